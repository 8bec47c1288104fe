import "server-only";
import type pg from "pg";
import { PARAMETRIC_BINS } from "@/domain/yield/lot-analysis";

// Set-based steps as the file's dies arrive in segments and once they all have, all inside the job's one transaction.
// Wafer median G is taken over the parametric dies (not NODATA, OPEN or SHORT): gross fails would only drag it.
const PARAMETRIC = `bin in (${PARAMETRIC_BINS.map((b) => `'${b}'`).join(", ")})`;

/** The wafers and dies of one job's file, as its segments arrive (placeSegment) and once all have (finishWafers). */
export interface WaferPlacement {
  tenantId: string;
  lotId: string;
  jobId: string;
  probedAt: Date;
  /** Wafer slots replaced so far: their old wafers and dies are gone and a row for the new wafer is in place. */
  slots: Set<number>;
  /** Whether a die may have arrived in more than one fragment (then tmp_dies is searched for them at the end). */
  mayRepeat: boolean;
  savepoints: number;
}

// A segment's dies go into dies inside a savepoint, so that a die split over the file (its key already taken)
// shows up as a unique violation and the segment is redone with ON CONFLICT DO NOTHING; the merged die replaces
// the first fragment at the end. Not ON CONFLICT for every segment: its speculative insertion cost 30–40 % more
// per die (125,000 dies: 1.9–2.2 s against 1.3–1.5 s on the development machine). At most this many savepoints,
// each one a subtransaction: PostgreSQL keeps up to 64 of a transaction's subtransaction ids in shared memory
// (PGPROC_MAX_CACHED_SUBXIDS in its source, from memory), and beyond that the other sessions' visibility checks
// have to look them up in pg_subtrans while the job runs. Past the limit every segment goes in with ON CONFLICT.
const MAX_SAVEPOINTS = 60;

const INSERT_DIES = `insert into dies (tenant_id, lot_id, wafer_slot, x, y, conductance_s, offset_a, r2, points_in_window, window_v,
                  nonlinearity, nonlinearity_window_only, modes, bin, reason, temperature_k, site, points, sweep)
     select $1, $2, wafer_slot, x, y, conductance_s, offset_a, r2, points_in_window, window_v, nonlinearity,
            nonlinearity_window_only, modes, bin, reason, temperature_k, site, points, sweep
       from tmp_dies`;
const IN_SEGMENT = "first_line > $3 and first_line <= $4";

/**
 * Moves one segment of tmp_dies, the dies whose first line is in (after, upTo], into dies. A wafer slot seen for
 * the first time replaces the lot's wafer in that slot: the old wafer and its dies go, and a row for the new wafer
 * takes its place, its counts filled in by finishWafers. Out-of-window flags are set there too, once the wafer's
 * window is known.
 */
export async function placeSegment(client: pg.PoolClient, p: WaferPlacement, after: number, upTo: number): Promise<void> {
  const segment = [p.tenantId, p.lotId, after, upTo];
  const { rows } = await client.query<{ slots: number[] | null }>("select array_agg(distinct wafer_slot) as slots from tmp_dies where first_line > $1 and first_line <= $2", [after, upTo]);
  const fresh = (rows[0]?.slots ?? []).filter((s) => !p.slots.has(s));
  if (fresh.length > 0) {
    await client.query("delete from wafers where tenant_id = $1 and lot_id = $2 and slot = any($3::int[])", [p.tenantId, p.lotId, fresh]);
    await client.query(
      `insert into wafers (tenant_id, lot_id, slot, tested, pass, bin_counts, job_id, probed_at)
       select $1, $2, s, 0, 0, '{}'::jsonb, $3, $4 from unnest($5::int[]) s`,
      [p.tenantId, p.lotId, p.jobId, p.probedAt, fresh],
    );
    for (const s of fresh) p.slots.add(s);
  }
  if (!p.mayRepeat && p.savepoints < MAX_SAVEPOINTS) {
    p.savepoints++;
    await client.query("savepoint die_segment");
    try {
      await client.query(`${INSERT_DIES} where ${IN_SEGMENT}`, segment);
      await client.query("release savepoint die_segment");
    } catch (error) {
      if ((error as { code?: string }).code !== "23505") throw error;
      await client.query("rollback to savepoint die_segment");
      await client.query("release savepoint die_segment");
      p.mayRepeat = true;
    }
  } else {
    p.mayRepeat = true;
  }
  if (p.mayRepeat) await client.query(`${INSERT_DIES} where ${IN_SEGMENT} on conflict do nothing`, segment);
}

/** Puts the named dies of tmp_dies (merged from their fragments) into dies, whose rows for them are gone. */
export async function placeDies(client: pg.PoolClient, p: WaferPlacement, keys: { wafers: number[]; xs: number[]; ys: number[] }): Promise<void> {
  await client.query(`${INSERT_DIES} where (wafer_slot, x, y) in (select * from unnest($3::int[], $4::int[], $5::int[]))`, [p.tenantId, p.lotId, keys.wafers, keys.xs, keys.ys]);
}

/**
 * Fills in the file's wafers once all its dies are in: counts, median G, bin counts and the die window, and flags
 * the dies outside that window.
 */
export async function finishWafers(
  client: pg.PoolClient, p: WaferPlacement, dieWindow: "static" | "pat", k: number, staticWindow: { lowS: number; highS: number } | null = null,
): Promise<number[]> {
  const { tenantId, lotId } = p;
  // Dynamic Part Average Testing per wafer (AEC-Q001): median ± k·(IQR/1.35) over the wafer's PASS dies.
  // A static window comes from the limit set in force at probe time (src/server/spc/static-window.ts); without one
  // no die is flagged.
  const windowSql =
    dieWindow === "pat"
      ? `select wafer_slot,
                percentile_cont(0.5) within group (order by conductance_s) - $3 * (percentile_cont(0.75) within group (order by conductance_s) - percentile_cont(0.25) within group (order by conductance_s)) / 1.35 as low,
                percentile_cont(0.5) within group (order by conductance_s) + $3 * (percentile_cont(0.75) within group (order by conductance_s) - percentile_cont(0.25) within group (order by conductance_s)) / 1.35 as high
           from tmp_dies where bin = 'PASS' group by wafer_slot`
      : staticWindow
        ? `select wafer_slot, $3::float8 as low, $4::float8 as high from tmp_dies group by wafer_slot`
        : `select wafer_slot, null::float8 as low, null::float8 as high from tmp_dies where false group by wafer_slot`;

  // Bin counts come from one grouped pass (a subquery per wafer rescanned tmp_dies 25 times), and out-of-window
  // counts from the window computed here (counting them in dies afterwards rescanned the lot's dies per wafer).
  // The dies are aggregated before the bin counts join in: joined first, every die carried its wafer's jsonb
  // through the sort (125,000 dies: 0.32–0.37 s, aggregated first 0.17–0.21 s).
  await client.query(
    `update wafers w set tested = a.tested, pass = a.pass, median_conductance_s = a.median, bin_counts = b.counts,
                         window_low_s = a.low, window_high_s = a.high, out_of_window = a.out_of_window
       from (select t.wafer_slot, w.low, w.high, count(*) as tested, count(*) filter (where t.bin = 'PASS') as pass,
                    percentile_cont(0.5) within group (order by t.conductance_s) filter (where t.${PARAMETRIC}) as median,
                    count(*) filter (where t.bin = 'PASS' and (t.conductance_s < w.low or t.conductance_s > w.high)) as out_of_window
               from tmp_dies t left join (${windowSql}) w on w.wafer_slot = t.wafer_slot
              group by t.wafer_slot, w.low, w.high) a
       join (select wafer_slot, jsonb_object_agg(bin, n) as counts
               from (select wafer_slot, bin, count(*) as n from tmp_dies group by wafer_slot, bin) c group by wafer_slot) b on b.wafer_slot = a.wafer_slot
      where w.tenant_id = $1 and w.lot_id = $2 and w.slot = a.wafer_slot`,
    dieWindow === "pat" ? [tenantId, lotId, k] : staticWindow ? [tenantId, lotId, staticWindow.lowS, staticWindow.highS] : [tenantId, lotId],
  );
  // The flagged dies, a few in a hundred, are found by their key one by one (a correlated subquery on the full
  // primary key can only be an index probe) and updated by row address. Joined to dies instead, with the new dies
  // not yet in the table's statistics, the planner misjudged their number: in a new database it looped over
  // tmp_dies for each die of the lot (2.1–2.4 s for 3,003 dies, quadratic), in one with millions of dies it scanned
  // all of them (3–11 s for a 500,000-die lot), and through a small indexed table of the flagged dies it still
  // walked every die of the lot (0.24 s for 125,000 dies, against 0.05 s by key). Only the row addresses in the
  // outer condition: with the lot's key there as well, the planner walked the lot's dies and searched the array
  // for each (2.5 s).
  await client.query(
    `update dies set out_of_window = true
      where ctid = any(array(
        select (select d.ctid from dies d where d.tenant_id = $1 and d.lot_id = $2 and d.wafer_slot = t.wafer_slot and d.x = t.x and d.y = t.y)
          from tmp_dies t join wafers w on w.tenant_id = $1 and w.lot_id = $2 and w.slot = t.wafer_slot
         where t.bin = 'PASS' and (t.conductance_s < w.window_low_s or t.conductance_s > w.window_high_s)))`,
    [tenantId, lotId],
  );
  return [...p.slots].sort((a, b) => a - b);
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
