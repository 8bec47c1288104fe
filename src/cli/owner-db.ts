// Statements as the schema owner inside one tenant, for the platform's own set-up (demo seed, test fixtures):
// app.tenant_id is set for the transaction so FORCEd row-level security is satisfied too.
import type pg from "pg";

export async function asTenant<T>(pool: pg.Pool, tenantId: string, fn: (client: pg.PoolClient) => Promise<T>): Promise<T> {
  const client = await pool.connect();
  try {
    await client.query("begin");
    await client.query("select set_config('app.tenant_id', $1, true)", [tenantId]);
    const result = await fn(client);
    await client.query("commit");
    return result;
  } catch (error) {
    await client.query("rollback");
    throw error;
  } finally {
    client.release();
  }
}
