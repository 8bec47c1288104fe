import "server-only";
import type pg from "pg";

/** The static die window of the limit set in force at probe time (the latest frozen at or before it), for ingest. */
export async function staticWindowInForce(client: pg.PoolClient, tenantId: string, productId: string, probedAt: Date): Promise<{ lowS: number; highS: number } | null> {
  const { rows } = await client.query<{ low: number | null; high: number | null }>(
    `select die_window_low_s as low, die_window_high_s as high from limit_sets
      where tenant_id = $1 and product_id = $2 and in_force_from <= $3 order by in_force_from desc, version desc limit 1`,
    [tenantId, productId, probedAt],
  );
  const row = rows[0];
  return row && row.low !== null && row.high !== null ? { lowS: row.low, highS: row.high } : null;
}
