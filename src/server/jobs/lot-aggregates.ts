import "server-only";
import type pg from "pg";
import { PARAMETRIC_BINS } from "@/domain/yield/lot-analysis";

// Set-based steps after the file is streamed into tmp_dies, all inside the job's one transaction.
// Wafer median G is taken over the parametric dies (not NODATA, OPEN or SHORT): gross fails would only drag it.
const PARAMETRIC = `bin in (${PARAMETRIC_BINS.map((b) => `'${b}'`).join(", ")})`;

/** Replaces the file's wafers of the lot: old wafers and their dies go, the new ones arrive whole. */
export async function replaceWafers(
  client: pg.PoolClient, tenantId: string, lotId: string, jobId: string, probedAt: Date, dieWindow: "static" | "pat", k: number,
  staticWindow: { lowS: number; highS: number } | null = null,
): Promise<number[]> {
  const { rows } = await client.query<{ wafer_slot: number }>("select distinct wafer_slot from tmp_dies order by 1");
  const slots = rows.map((r) => r.wafer_slot);
  await client.query("delete from wafers where tenant_id = $1 and lot_id = $2 and slot = any($3::int[])", [tenantId, lotId, slots]);

  // Dynamic Part Average Testing per wafer (AEC-Q001): median ± k·(IQR/1.35) over the wafer's PASS dies.
  // A static window comes from the limit set in force at probe time (src/server/spc/static-window.ts); without one
  // no die is flagged.
  const windowSql =
    dieWindow === "pat"
      ? `select wafer_slot,
                percentile_cont(0.5) within group (order by conductance_s) - $5 * (percentile_cont(0.75) within group (order by conductance_s) - percentile_cont(0.25) within group (order by conductance_s)) / 1.35 as low,
                percentile_cont(0.5) within group (order by conductance_s) + $5 * (percentile_cont(0.75) within group (order by conductance_s) - percentile_cont(0.25) within group (order by conductance_s)) / 1.35 as high
           from tmp_dies where bin = 'PASS' group by wafer_slot`
      : staticWindow
        ? `select wafer_slot, $5::float8 as low, $6::float8 as high from tmp_dies group by wafer_slot`
        : `select wafer_slot, null::float8 as low, null::float8 as high from tmp_dies where false group by wafer_slot`;

  // Bin counts come from one grouped pass (a subquery per wafer rescanned tmp_dies 25 times), and out-of-window
  // counts from the window computed here (counting them in dies afterwards rescanned the lot's dies per wafer).
  // The dies are aggregated before the bin counts join in: joined first, every die carried its wafer's jsonb
  // through the sort (125,000 dies: 0.32–0.37 s, aggregated first 0.17–0.21 s).
  await client.query(
    `insert into wafers (tenant_id, lot_id, slot, tested, pass, median_conductance_s, bin_counts, window_low_s, window_high_s, out_of_window, job_id, probed_at)
     select $1, $2, a.wafer_slot, a.tested, a.pass, a.median, b.counts, a.low, a.high, a.out_of_window, $3, $4
       from (select t.wafer_slot, w.low, w.high, count(*) as tested, count(*) filter (where t.bin = 'PASS') as pass,
                    percentile_cont(0.5) within group (order by t.conductance_s) filter (where t.${PARAMETRIC}) as median,
                    count(*) filter (where t.bin = 'PASS' and (t.conductance_s < w.low or t.conductance_s > w.high)) as out_of_window
               from tmp_dies t left join (${windowSql}) w on w.wafer_slot = t.wafer_slot
              group by t.wafer_slot, w.low, w.high) a
       join (select wafer_slot, jsonb_object_agg(bin, n) as counts
               from (select wafer_slot, bin, count(*) as n from tmp_dies group by wafer_slot, bin) c group by wafer_slot) b on b.wafer_slot = a.wafer_slot`,
    dieWindow === "pat" ? [tenantId, lotId, jobId, probedAt, k] : staticWindow ? [tenantId, lotId, jobId, probedAt, staticWindow.lowS, staticWindow.highS] : [tenantId, lotId, jobId, probedAt],
  );
  await client.query(
    `insert into dies (tenant_id, lot_id, wafer_slot, x, y, conductance_s, offset_a, r2, points_in_window, window_v, nonlinearity,
                       nonlinearity_window_only, modes, bin, reason, temperature_k, site, points, sweep, out_of_window)
     select $1, $2, t.wafer_slot, t.x, t.y, t.conductance_s, t.offset_a, t.r2, t.points_in_window, t.window_v, t.nonlinearity,
            t.nonlinearity_window_only, t.modes, t.bin, t.reason, t.temperature_k, t.site, t.points, t.sweep,
            coalesce(t.bin = 'PASS' and (t.conductance_s < w.window_low_s or t.conductance_s > w.window_high_s), false)
       from tmp_dies t join wafers w on w.tenant_id = $1 and w.lot_id = $2 and w.slot = t.wafer_slot`,
    [tenantId, lotId],
  );
  return slots;
}

/** Recomputes the lot's totals over all its wafers (those of earlier files included). */
export async function refreshLotTotals(client: pg.PoolClient, tenantId: string, lotId: string): Promise<void> {
  await client.query(
    `update lots l set tested = s.tested, pass = s.pass, out_of_window = s.oow, median_conductance_s = s.median, updated_at = now()
       from (select count(*) as tested, count(*) filter (where bin = 'PASS') as pass, count(*) filter (where out_of_window) as oow,
                    percentile_cont(0.5) within group (order by conductance_s) filter (where ${PARAMETRIC}) as median
               from dies where tenant_id = $1 and lot_id = $2) s
      where l.tenant_id = $1 and l.id = $2`,
    [tenantId, lotId],
  );
}
