import { describe, expect, it } from "vitest";
import { createSampleProduct, fixture, upload } from "@/test/ingest-helpers";
import { createTestTenant, ownerPool } from "@/test/tenants";
import { listenForIngest } from "./job-signal";

describe("the ingest queue's wake-up (LISTEN/NOTIFY)", () => {
  it("wakes a waiting worker when an upload queues a job, and times out when nothing is queued", async () => {
    const pool = ownerPool();
    try {
      const tenant = await createTestTenant(pool, "job-signal");
      await createSampleProduct(tenant);
      const idle = await listenForIngest();
      const started = Date.now();
      expect(await idle.wait(300)).toBe(false);
      expect(Date.now() - started).toBeGreaterThanOrEqual(290);

      // Queued between listening and waiting: not missed.
      const signal = await listenForIngest();
      expect((await upload(tenant, fixture("good-small.csv"))).status).toBe(202);
      expect(await signal.wait(10_000)).toBe(true);
    } finally {
      await pool.end();
    }
  });
});
