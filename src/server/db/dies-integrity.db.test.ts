import type pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createSampleProduct, ingestAndWait } from "@/test/ingest-helpers";
import { probeFile } from "@/test/spc-files";
import { createTestTenant, ownerPool, type TestTenant } from "@/test/tenants";

// dies → wafers integrity is kept by statement-level triggers (migration 20261202_1200) rather than a per-row
// foreign key: the guarantees the foreign key gave, checked one by one.
const pool = ownerPool();
let tenant: TestTenant;
let lotId = "";
const G = 1.3e-6;

beforeAll(async () => {
  tenant = await createTestTenant(pool, "dies-integrity");
  await createSampleProduct(tenant);
  const job = await ingestAndWait(tenant, probeFile("INTEGRITY-01", "VD-NW40", [1, 2, 3].map((slot) => ({ slot, diesS: [G, G, G, G] }))));
  expect(job.status).toBe("done");
  lotId = (await pool.query("select id from lots where tenant_id = $1 and lot_number = 'INTEGRITY-01'", [tenant.id])).rows[0].id;
}, 60_000);
afterAll(() => pool.end());

/** Runs `work` in a transaction scoped to the tenant and rolls it back, so each case starts from the ingested lot. */
async function inTenant<T>(work: (client: pg.PoolClient) => Promise<T>): Promise<T> {
  const client = await pool.connect();
  try {
    await client.query("begin");
    await client.query("select set_config('app.tenant_id', $1, true)", [tenant.id]);
    return await work(client);
  } finally {
    await client.query("rollback");
    client.release();
  }
}
const countDies = async (client: pg.PoolClient, where = "true") =>
  (await client.query(`select count(*)::int as n from dies where tenant_id = $1 and lot_id = $2 and ${where}`, [tenant.id, lotId])).rows[0].n as number;
/** One insert statement of copies of die (1, 0, 0) at row y = 99, one per [wafer slot, x]. */
const copyDies = (at: [number, number][]) =>
  `insert into dies (tenant_id, lot_id, wafer_slot, x, y, conductance_s, points_in_window, window_v, nonlinearity_window_only, bin, temperature_k, points, sweep)
   select d.tenant_id, d.lot_id, v.slot, v.x, 99, d.conductance_s, d.points_in_window, d.window_v, d.nonlinearity_window_only, d.bin, d.temperature_k, d.points, d.sweep
     from dies d cross join (values ${at.map(([slot, x]) => `(${slot}, ${x})`).join(", ")}) v(slot, x)
    where d.tenant_id = $1 and d.lot_id = $2 and d.wafer_slot = 1 and d.x = 0 and d.y = 0`;

describe("dies keep to their wafers (statement-level checks)", () => {
  it("refuses a statement whose dies name a missing wafer, writing none of them, and accepts one on existing wafers", async () => {
    await inTenant(async (client) => {
      await client.query("savepoint s");
      const refused = await client.query(copyDies([[1, 51], [7, 50]]), [tenant.id, lotId]).catch((e: { code: string; detail: string }) => e);
      expect(refused).toMatchObject({ code: "23503" });
      expect((refused as { detail: string }).detail).toContain(`${lotId}, 7)`);
      await client.query("rollback to savepoint s");
      expect(await countDies(client, "y = 99")).toBe(0);
      await client.query(copyDies([[2, 60], [3, 60]]), [tenant.id, lotId]);
      expect(await countDies(client, "y = 99")).toBe(2);
    });
  });

  it("refuses moving a die to a missing wafer", async () => {
    await inTenant(async (client) => {
      const refused = await client.query("update dies set wafer_slot = 9 where tenant_id = $1 and lot_id = $2 and wafer_slot = 3 and x = 0 and y = 0", [tenant.id, lotId]).catch((e: { code: string }) => e);
      expect(refused).toMatchObject({ code: "23503" });
    });
  });

  it("deletes a wafer's dies with it and no other wafer's, and a lot's with the lot", async () => {
    await inTenant(async (client) => {
      expect(await countDies(client)).toBe(12);
      await client.query("delete from wafers where tenant_id = $1 and lot_id = $2 and slot = 2", [tenant.id, lotId]);
      expect(await countDies(client, "wafer_slot = 2")).toBe(0);
      expect(await countDies(client)).toBe(8);
      await client.query("delete from lots where tenant_id = $1 and id = $2", [tenant.id, lotId]);
      expect(await countDies(client)).toBe(0);
    });
  });

  it("refuses changing the key of a wafer that has dies, and allows it once the wafer has none", async () => {
    await inTenant(async (client) => {
      await client.query("savepoint s");
      const refused = await client.query("update wafers set slot = 20 where tenant_id = $1 and lot_id = $2 and slot = 1", [tenant.id, lotId]).catch((e: { code: string }) => e);
      expect(refused).toMatchObject({ code: "23503" });
      await client.query("rollback to savepoint s");
      await client.query("delete from dies where tenant_id = $1 and lot_id = $2 and wafer_slot = 1", [tenant.id, lotId]);
      await client.query("update wafers set slot = 20 where tenant_id = $1 and lot_id = $2 and slot = 1", [tenant.id, lotId]);
      expect((await client.query("select slot from wafers where tenant_id = $1 and lot_id = $2 order by slot", [tenant.id, lotId])).rows.map((r) => r.slot)).toEqual([2, 3, 20]);
    });
  });
});
