import "server-only";
import type pg from "pg";
import { BINS } from "@/domain/transport/linear-response";
import { PARAMETRIC_BINS } from "@/domain/yield/lot-analysis";

// Set-based steps as the file's dies arrive in segments and once they all have, all inside the job's one transaction.
// Wafer median G is taken over the parametric dies (not NODATA, OPEN or SHORT): gross fails would only drag it.
const PARAMETRIC = `bin in (${PARAMETRIC_BINS.map((b) => `'${b}'`).join(", ")})`;
// A wafer's bin counts as a jsonb object of the bins it has, e.g. {"PASS": 4870, "OPEN": 12}, counted in the
// grouped pass: one count per bin, the zero ones dropped.
const BIN_COUNTS = `jsonb_strip_nulls(jsonb_build_object(${BINS.map((b) => `'${b}', nullif(count(*) filter (where bin = '${b}'), 0)`).join(", ")}))`;

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
// have to look them up in pg_subtrans while the job runs. Past the limit every segment goes in with ON CONFLICT,
// and a segment that inserted fewer dies than it holds marks the file as having split dies. (Marking every file
// past the limit that way made a 2 GB file, 77 segments, search all its 7.5 M dies for fragments: 15 s.)
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
  const { rows } = await client.query<{ slots: number[] | null; dies: number }>(
    "select array_agg(distinct wafer_slot) as slots, count(*)::int as dies from tmp_dies where first_line > $1 and first_line <= $2",
    [after, upTo],
  );
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
      return;
    } catch (error) {
      if ((error as { code?: string }).code !== "23505") throw error;
      await client.query("rollback to savepoint die_segment");
      await client.query("release savepoint die_segment");
      p.mayRepeat = true;
    }
  }
  // A die left out here had its key taken: it came in fragments, which the job merges at the end.
  const inserted = await client.query(`${INSERT_DIES} where ${IN_SEGMENT} on conflict do nothing`, segment);
  if (inserted.rowCount !== rows[0]!.dies) p.mayRepeat = true;
}

/** Puts the named dies of tmp_dies (merged from their fragments) into dies, whose rows for them are gone. */
export async function placeDies(client: pg.PoolClient, p: WaferPlacement, keys: { wafers: number[]; xs: number[]; ys: number[] }): Promise<void> {
  await client.query(`${INSERT_DIES} where (wafer_slot, x, y) in (select * from unnest($3::int[], $4::int[], $5::int[]))`, [p.tenantId, p.lotId, keys.wafers, keys.xs, keys.ys]);
}

export interface FinishedWafers {
  /** The file's wafer slots, in order. */
  slots: number[];
  /** Median G over the file's parametric dies: the lot's median when the lot has no other wafers. */
  medianConductanceS: number | null;
  /** Dies of the file per bin, the bins it has. */
  binCounts: Record<string, number>;
}

/**
 * Fills in the file's wafers once all its dies are in: counts, median G, bin counts and the die window, and flags
 * the dies outside that window.
 */
export async function finishWafers(
  client: pg.PoolClient, p: WaferPlacement, dieWindow: "static" | "pat", k: number, staticWindow: { lowS: number; highS: number } | null = null,
): Promise<FinishedWafers> {
  const { tenantId, lotId } = p;
  // Dynamic Part Average Testing per wafer (AEC-Q001): median ± k·(IQR/1.35) over the wafer's PASS dies, the three
  // quartiles from one ordered-set aggregate. A static window comes from the limit set in force at probe time
  // (src/server/spc/static-window.ts); without one no die is flagged.
  const [low, high, params] =
    dieWindow === "pat"
      ? ["a.q[2] - $3 * (a.q[3] - a.q[1]) / 1.35", "a.q[2] + $3 * (a.q[3] - a.q[1]) / 1.35", [tenantId, lotId, k]]
      : staticWindow
        ? ["$3::float8", "$4::float8", [tenantId, lotId, staticWindow.lowS, staticWindow.highS]]
        : ["null::float8", "null::float8", [tenantId, lotId]];
  // One grouped pass over tmp_dies for everything a wafer row holds: counts, median G, quartiles and bin counts;
  // the rollup's total row gives the file's median G and bin counts too. Joined to a window subquery and to a grouped bin count
  // as before, tmp_dies was read three times and sorted twice (1,127,675 dies: 2.4 s against 1.2–1.5 s in one
  // pass, JIT off).
  const { rows } = await client.query<{ median: number | null; counts: Record<string, number> }>(
    `with a as (
       select wafer_slot, grouping(wafer_slot) = 1 as whole_file, count(*) as tested, count(*) filter (where bin = 'PASS') as pass,
              percentile_cont(0.5) within group (order by conductance_s) filter (where ${PARAMETRIC}) as median,
              percentile_cont(array[0.25, 0.5, 0.75]) within group (order by conductance_s) filter (where bin = 'PASS') as q,
              ${BIN_COUNTS} as counts
         from tmp_dies group by rollup (wafer_slot)),
     updated as (
       update wafers w set tested = a.tested, pass = a.pass, median_conductance_s = a.median, bin_counts = a.counts,
                           window_low_s = ${low}, window_high_s = ${high}, out_of_window = 0
         from a where not a.whole_file and w.tenant_id = $1 and w.lot_id = $2 and w.slot = a.wafer_slot)
     select median, counts from a where whole_file`,
    params,
  );
  // The flagged dies, a few in a hundred, are found by their key one by one (a correlated subquery on the full
  // primary key can only be an index probe) and updated by row address; the wafers count what was flagged.
  // Joined to dies instead, with the new dies not yet in the table's statistics, the planner misjudged their
  // number: in a new database it looped over tmp_dies for each die of the lot (2.1–2.4 s for 3,003 dies,
  // quadratic), in one with millions of dies it scanned all of them (3–11 s for a 500,000-die lot), and through a
  // small indexed table of the flagged dies it still walked every die of the lot (0.24 s for 125,000 dies, against
  // 0.05 s by key). Only the row addresses in the outer condition: with the lot's key there as well, the planner
  // walked the lot's dies and searched the array for each (2.5 s).
  await client.query(
    `with flagged as (
       update dies set out_of_window = true
        where ctid = any(array(
          select (select d.ctid from dies d where d.tenant_id = $1 and d.lot_id = $2 and d.wafer_slot = t.wafer_slot and d.x = t.x and d.y = t.y)
            from tmp_dies t join wafers w on w.tenant_id = $1 and w.lot_id = $2 and w.slot = t.wafer_slot
           where t.bin = 'PASS' and (t.conductance_s < w.window_low_s or t.conductance_s > w.window_high_s)))
       returning wafer_slot)
     update wafers w set out_of_window = f.n
       from (select wafer_slot, count(*) as n from flagged group by wafer_slot) f
      where w.tenant_id = $1 and w.lot_id = $2 and w.slot = f.wafer_slot`,
    [tenantId, lotId],
  );
  const slots = [...p.slots].sort((a, b) => a - b);
  return { slots, medianConductanceS: rows[0]?.median ?? null, binCounts: rows[0]?.counts ?? {} };
}

/**
 * Recomputes the lot's totals over all its wafers (those of earlier files included): the counts from the wafers,
 * the median G from the file's when the file holds every wafer of the lot, else over all the lot's dies (a scan
 * of them took 0.8–1.8 s for 1,127,675 dies).
 */
export async function refreshLotTotals(client: pg.PoolClient, p: WaferPlacement, file: FinishedWafers): Promise<void> {
  const { rows } = await client.query<{ others: boolean }>(
    "select exists (select from wafers where tenant_id = $1 and lot_id = $2 and slot <> all($3::int[])) as others",
    [p.tenantId, p.lotId, file.slots],
  );
  const median = rows[0]!.others
    ? `(select percentile_cont(0.5) within group (order by conductance_s) filter (where ${PARAMETRIC}) from dies where tenant_id = $1 and lot_id = $2)`
    : "$3::float8";
  await client.query(
    `update lots l set tested = s.tested, pass = s.pass, out_of_window = s.oow, median_conductance_s = ${median}, updated_at = now()
       from (select coalesce(sum(tested), 0) as tested, coalesce(sum(pass), 0) as pass, coalesce(sum(out_of_window), 0) as oow
               from wafers where tenant_id = $1 and lot_id = $2) s
      where l.tenant_id = $1 and l.id = $2`,
    rows[0]!.others ? [p.tenantId, p.lotId] : [p.tenantId, p.lotId, file.medianConductanceS],
  );
}
