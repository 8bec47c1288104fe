import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, createSampleProduct, fixture, ingestAndWait } from "@/test/ingest-helpers";
import { createTestTenant, ownerPool, type TestTenant } from "@/test/tenants";

const pool = ownerPool();
let tenant: TestTenant;

beforeAll(async () => {
  tenant = await createTestTenant(pool, "limits-in-force");
  await createSampleProduct(tenant);
  await ingestAndWait(tenant, fixture("good-small.csv")); // measured_at 2026-11-28T06:40:00Z
});
afterAll(() => pool.end());

const freeze = (body: unknown) =>
  api(tenant, "engineer", "/api/v1/products/VD-NW40/limits", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });

describe("when a frozen limit set comes into force", () => {
  it("refuses a start before the newest baseline lot was probed, or in the future", async () => {
    const early = await freeze({ lots: ["TW2611-0147"], inForceFrom: "2026-11-01T00:00:00Z" });
    expect(early.status).toBe(422);
    expect((await early.json()).error.message).toMatch(/newest lot was probed 2026-11-28T06:40:00.000Z/);
    expect((await freeze({ lots: ["TW2611-0147"], inForceFrom: "2999-01-01T00:00:00Z" })).status).toBe(422);
  });

  it("records the freeze time and the stated start separately", async () => {
    const response = await freeze({ lots: ["TW2611-0147"], inForceFrom: "2026-11-29T00:00:00Z" });
    expect(response.status).toBe(201);
    const version = await response.json();
    expect(version.inForceFrom).toBe("2026-11-29T00:00:00.000Z");
    expect(Date.parse(version.frozenAt)).toBeGreaterThan(Date.parse(version.inForceFrom));
    const { versions } = await (await api(tenant, "analyst", "/api/v1/products/VD-NW40/limits")).json();
    expect(versions.map((v: { version: number }) => v.version)).toEqual([version.version]);
  });
});
