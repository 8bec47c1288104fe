import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestTenant, ownerPool, type TestTenant } from "@/test/tenants";
import { claimNextJob, type ClaimedJob, heartbeat } from "./queue";

const pool = ownerPool();
let tenant: TestTenant;

/** Jobs whose raw file does not exist: these tests only claim them. The suite's own worker may claim them too. */
async function queueJob(state: "queued" | "dead-worker"): Promise<string> {
  const file = await pool.query("insert into raw_files (tenant_id, sha256, size_bytes, object_key, uploaded_by) values ($1, $2, 1, 'nowhere', 'queue test') returning id", [tenant.id, randomUUID()]);
  const job = await pool.query(
    state === "queued"
      ? "insert into ingest_jobs (tenant_id, raw_file_id, lot_number, product_code, created_by) values ($1, $2, 'Q', 'Q', 'queue test') returning id"
      : "insert into ingest_jobs (tenant_id, raw_file_id, lot_number, product_code, created_by, status, attempts, lease_until) values ($1, $2, 'Q', 'Q', 'queue test', 'running', 1, now() - interval '1 second') returning id",
    [tenant.id, file.rows[0].id],
  );
  return job.rows[0].id;
}

beforeAll(async () => {
  tenant = await createTestTenant(pool, "queue");
});
afterAll(async () => {
  await pool.query("update ingest_jobs set status = 'failed', lease_until = null where tenant_id = $1", [tenant.id]);
  await pool.end();
});

describe("the ingest queue (FOR UPDATE SKIP LOCKED with leases)", () => {
  it("never hands one job to two workers claiming at the same time (threat: a lot ingested twice)", async () => {
    const ids = await Promise.all(Array.from({ length: 12 }, () => queueJob("queued")));
    const claims = (await Promise.all(Array.from({ length: 24 }, () => claimNextJob({ tenantId: tenant.id })))).filter((c): c is ClaimedJob => c !== null);
    const claimed = claims.map((c) => c.id);
    expect(new Set(claimed).size).toBe(claimed.length);
    expect(claimed.length).toBeGreaterThan(0);
    const { rows } = await pool.query("select attempts from ingest_jobs where id = any($1::uuid[])", [ids]);
    for (const row of rows) expect(row.attempts).toBeLessThanOrEqual(1); // claimed once at most, by whichever worker won
  });

  it("gives a job whose worker died to the next worker when the lease runs out, and fences off the late worker", async () => {
    const id = await queueJob("dead-worker");
    const deadWorker: ClaimedJob = { tenantId: tenant.id, id, rawFileId: "", lotNumber: "Q", productCode: "Q", chuckTemperatureK: null, attempts: 1 };
    const next = await claimNextJob({ tenantId: tenant.id });
    // Reclaimed once, by this claimer or by the suite's worker (woken by the queued job, it may hold the row while
    // this claim skips it; its claim then commits a moment later).
    const attempts = async () => (await pool.query("select attempts from ingest_jobs where id = $1", [id])).rows[0].attempts;
    await expect.poll(attempts, { timeout: 10_000 }).toBe(2);
    expect(await heartbeat(deadWorker, 0.5)).toBe(false); // the late worker can no longer renew or finish it
    if (next?.id === id) expect(await heartbeat(next, 0.5)).toBe(true);
  });
});
