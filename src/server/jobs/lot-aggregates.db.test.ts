import { afterAll, describe, expect, it } from "vitest";
import type pg from "pg";
import { createSampleProduct } from "@/test/ingest-helpers";
import { createTestTenant, ownerPool } from "@/test/tenants";
import { CREATE_TMP_DIES, INDEX_TMP_DIES } from "./die-copy";
import { finishWafers, placeSegment, refreshLotTotals, type WaferPlacement } from "./lot-aggregates";

const pool = ownerPool();
afterAll(() => pool.end());

/** A job's transaction with its temp tables and a fresh lot of the sample product, rolled back at the end. */
async function inJob(run: (client: pg.PoolClient, placement: WaferPlacement) => Promise<void>) {
  const tenant = await createTestTenant(pool, "segments");
  await createSampleProduct(tenant);
  const client = await pool.connect();
  try {
    await client.query("begin");
    await client.query("select set_config('app.tenant_id', $1, true)", [tenant.id]);
    await client.query(CREATE_TMP_DIES);
    await client.query(INDEX_TMP_DIES);
    const product = await client.query("select id from products where tenant_id = $1", [tenant.id]);
    const jobId = crypto.randomUUID();
    const lot = await client.query(
      `insert into lots (tenant_id, lot_number, product_id, status, chuck_temperature_k, probed_at, attributes, last_job_id)
       values ($1, 'SEG-1', $2, 'probed', 300, now(), '{}', $3) returning id`,
      [tenant.id, product.rows[0].id, jobId],
    );
    await run(client, { tenantId: tenant.id, lotId: lot.rows[0].id, jobId, probedAt: new Date(), slots: new Set(), mayRepeat: false, savepoints: 0 });
  } finally {
    await client.query("rollback");
    client.release();
  }
}

type TmpDie = [wafer: number, x: number, y: number, g: number, bin?: string];

/** Puts dies (wafer, x, y, G, bin PASS unless given) into tmp_dies as the COPY would, on lines from firstLine on; returns their range of lines. */
async function segment(client: pg.PoolClient, dies: TmpDie[], firstLine = 1): Promise<[number, number]> {
  for (const [i, [wafer, x, y, g, bin = "PASS"]] of dies.entries()) {
    await client.query(
      `insert into tmp_dies (wafer_slot, x, y, conductance_s, points_in_window, window_v, nonlinearity_window_only, bin, temperature_k, points, sweep, first_line)
       values ($1, $2, $3, $4, 7, 0.013, false, $6, 300, 0, '\\x', $5)`,
      [wafer, x, y, g, firstLine + i, bin],
    );
  }
  return [firstLine - 1, firstLine + dies.length - 1];
}

const count = async (client: pg.PoolClient, sql: string, params: unknown[]) => (await client.query(sql, params)).rows.map((r) => Object.values(r));

describe("placing a job's dies segment by segment", () => {
  it("replaces a wafer when its slot first appears, keeps the lot's other wafers, and moves each segment into dies and tmp_dies", async () => {
    await inJob(async (client, p) => {
      // An earlier file's wafers 1 and 3, with a die each.
      await client.query(
        `insert into wafers (tenant_id, lot_id, slot, tested, pass, bin_counts, job_id, probed_at) select $1, $2, s, 1, 1, '{}', $3, now() from unnest('{1,3}'::int[]) s`,
        [p.tenantId, p.lotId, p.jobId],
      );
      await client.query(
        `insert into dies (tenant_id, lot_id, wafer_slot, x, y, points_in_window, window_v, nonlinearity_window_only, bin, temperature_k, points, sweep)
         select $1, $2, s, 40, 40, 7, 0.013, false, 'PASS', 300, 0, '\\x' from unnest('{1,3}'::int[]) s`,
        [p.tenantId, p.lotId],
      );
      await placeSegment(client, p, ...(await segment(client, [[1, 0, 0, 1e-6], [1, 1, 0, 1e-6]])));
      await placeSegment(client, p, ...(await segment(client, [[1, 2, 0, 1e-6], [2, 0, 0, 1e-6]], 3)));
      expect([...p.slots].sort()).toEqual([1, 2]);
      expect(p.mayRepeat).toBe(false);
      const dies = await count(client, "select wafer_slot, x, y from dies where lot_id = $1 order by 1, 2, 3", [p.lotId]);
      expect(dies).toEqual([[1, 0, 0], [1, 1, 0], [1, 2, 0], [2, 0, 0], [3, 40, 40]]); // wafer 1's old die is gone, wafer 3 untouched
      expect(await count(client, "select count(*)::int from tmp_dies", [])).toEqual([[4]]);
    });
  });

  it("meets a die already in place with a unique violation, redoes that segment keeping the first fragment, and says a die may repeat", async () => {
    await inJob(async (client, p) => {
      await placeSegment(client, p, ...(await segment(client, [[1, 0, 0, 1e-6], [1, 1, 0, 1e-6]])));
      await placeSegment(client, p, ...(await segment(client, [[1, 0, 0, 2e-6], [1, 5, 5, 1e-6]], 10)));
      expect(p.mayRepeat).toBe(true);
      expect(await count(client, "select x, y, conductance_s from dies where lot_id = $1 order by 1, 2", [p.lotId])).toEqual([[0, 0, 1e-6], [1, 0, 1e-6], [5, 5, 1e-6]]);
      expect(await count(client, "select count(*)::int from tmp_dies", [])).toEqual([[4]]); // both fragments, for the merge
      // Still in the job's transaction: the rolled-back savepoint took nothing else with it.
      expect(await count(client, "select count(*)::int from wafers where lot_id = $1", [p.lotId])).toEqual([[1]]);
    });
  });

  it("stops taking savepoints after 60 segments and puts the rest in with ON CONFLICT, noting a die left out", async () => {
    await inJob(async (client, p) => {
      p.savepoints = 60;
      await placeSegment(client, p, ...(await segment(client, [[1, 0, 0, 1e-6], [1, 1, 0, 2e-6]])));
      expect(p.savepoints).toBe(60);
      expect(p.mayRepeat).toBe(false); // every die of the segment went in
      await placeSegment(client, p, ...(await segment(client, [[1, 2, 0, 3e-6], [1, 0, 0, 4e-6]], 3)));
      expect(p.savepoints).toBe(60);
      expect(p.mayRepeat).toBe(true);
      expect(await count(client, "select x, conductance_s from dies where lot_id = $1 order by x", [p.lotId])).toEqual([[0, 1e-6], [1, 2e-6], [2, 3e-6]]);
    });
  });

  it("fills in the wafers and flags only the PASS dies outside the wafer's PAT window", async () => {
    await inJob(async (client, p) => {
      const band = (wafer: number) => Array.from({ length: 40 }, (_, i): TmpDie => [wafer, i, 0, 1e-6 * (1 + ((i % 9) - 4) * 1e-3)]);
      // Wafer 2: the same band, an OPEN die (no parametric G) and a HIGH die far out, neither of them PASS.
      const wafer2: TmpDie[] = [...band(2), [2, 98, 0, 1e-12, "OPEN"], [2, 99, 0, 5e-6, "HIGH"]];
      await placeSegment(client, p, ...(await segment(client, [...band(1), [1, 99, 0, 3e-6], ...wafer2])));
      expect(await finishWafers(client, p, "pat", 6)).toEqual({ slots: [1, 2], medianConductanceS: 1e-6, binCounts: { PASS: 81, OPEN: 1, HIGH: 1 } });
      const wafers = (await client.query("select slot, tested, pass, out_of_window, window_low_s, window_high_s, median_conductance_s, bin_counts from wafers where lot_id = $1 order by slot", [p.lotId])).rows;
      expect(wafers[0]).toMatchObject({ tested: 41, pass: 41, out_of_window: 1, bin_counts: { PASS: 41 } });
      expect(wafers[0].window_low_s).toBeLessThan(1e-6);
      expect(wafers[0].window_high_s).toBeLessThan(3e-6);
      // Only the bins the wafer has; the median over PASS and HIGH (41 dies: the band's median, 1e-6), not OPEN.
      expect(wafers[1]).toMatchObject({ tested: 42, pass: 40, out_of_window: 0, bin_counts: { PASS: 40, OPEN: 1, HIGH: 1 }, median_conductance_s: 1e-6 });
      expect(Object.keys(wafers[1].bin_counts)).toHaveLength(3);
      expect(wafers[1].window_high_s).toBeLessThan(5e-6); // the HIGH die is outside too, but only PASS dies are flagged
      expect(await count(client, "select wafer_slot, x from dies where lot_id = $1 and out_of_window", [p.lotId])).toEqual([[1, 99]]);
    });
  });

  it("totals the lot from its wafers, the median from the file alone only when the file holds every wafer", async () => {
    await inJob(async (client, p) => {
      await placeSegment(client, p, ...(await segment(client, [[1, 0, 0, 1e-6], [1, 1, 0, 2e-6], [1, 2, 0, 1e-12, "OPEN"], [2, 0, 0, 4e-6]])));
      await refreshLotTotals(client, p, await finishWafers(client, p, "static", 6, { lowS: 5e-7, highS: 3e-6 }));
      const lot = "select tested, pass, out_of_window, median_conductance_s from lots where id = $1";
      expect(await count(client, lot, [p.lotId])).toEqual([[4, 3, 1, 2e-6]]);
      // A second file with wafer 2 only: wafer 1 stays, so the median is taken over all the lot's dies.
      await client.query("delete from tmp_dies");
      const second: WaferPlacement = { ...p, jobId: crypto.randomUUID(), slots: new Set(), savepoints: 0 };
      await placeSegment(client, second, ...(await segment(client, [[2, 0, 0, 8e-6], [2, 1, 0, 9e-6]])));
      await refreshLotTotals(client, second, await finishWafers(client, second, "static", 6, { lowS: 5e-7, highS: 3e-6 }));
      const [tested, pass, outOfWindow, median] = (await count(client, lot, [p.lotId]))[0]!;
      expect([tested, pass, outOfWindow]).toEqual([5, 4, 2]);
      expect(median).toBeCloseTo(5e-6, 15); // between 2 and 8 µS of 1, 2, 8 and 9 µS
    });
  });

  it("leaves every die unflagged and the window empty when the product has no static window in force", async () => {
    await inJob(async (client, p) => {
      await placeSegment(client, p, ...(await segment(client, [[3, 0, 0, 1e-6], [3, 1, 0, 9e-6]])));
      await finishWafers(client, p, "static", 6, null);
      expect(await count(client, "select out_of_window, window_low_s, window_high_s from wafers where lot_id = $1", [p.lotId])).toEqual([[0, null, null]]);
      await finishWafers(client, p, "static", 6, { lowS: 5e-7, highS: 2e-6 });
      expect(await count(client, "select out_of_window, window_low_s, window_high_s from wafers where lot_id = $1", [p.lotId])).toEqual([[1, 5e-7, 2e-6]]);
      expect(await count(client, "select x from dies where lot_id = $1 and out_of_window", [p.lotId])).toEqual([[1]]);
    });
  });
});
