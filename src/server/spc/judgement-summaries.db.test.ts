import { mean as referenceMean, sampleStandardDeviation as referenceSd } from "simple-statistics";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { capability, xbarSChart } from "@/domain/spc";
import { assignZones, type Bin, edgeVersusCentre, waferGeometry, zoneYields } from "@/domain/yield";
import { PARAMETRIC_BINS } from "@/domain/yield/lot-analysis";
import { api, createSampleProduct, ingestAndWait } from "@/test/ingest-helpers";
import { probeFile } from "@/test/spc-files";
import { createTestTenant, ownerPool, type TestTenant } from "@/test/tenants";
import { type Scope, withScope } from "../db/scope";
import { dieCapability } from "./die-capability";
import { EDGE_RING_MIN_EDGE_DIES, EDGE_RING_MIN_GAP, edgeChecks } from "./edge-ring";

// The judge's die-level figures come from PostgreSQL summaries (capability) and one wafer at a time (edge ring), so
// memory stays flat on large lots. Checked here against the domain functions fed every die's value from the API, and
// the overall mean and sd against simple-statistics.
const pool = ownerPool();
const LOT = "SUMMARY-01";
const GEOMETRY = { dieWidthMm: 7, dieHeightMm: 7, waferDiameterMm: 150, edgeExclusionMm: 3 };
const SPEC = { specLowS: 1.0e-6, specHighS: 1.65e-6 };
let tenant: TestTenant;
let lotId = "";

/** A repeatable spread around 1.3 µS for die i of a wafer. */
const spread = (slot: number, i: number) => 1.3e-6 * (1 + 0.04 * Math.sin(1.7 * i + slot) + 0.01 * slot);
// Wafer 1: 36 in-spec dies. Wafer 2: 49 dies with LOW, HIGH and OPEN ones (unequal subgroup sizes, so s̄ is pooled).
// Wafer 3: one parametric die among opens (too few to be a subgroup). Wafer 4: a 20 × 20 grid whose outer dies are
// open, an edge ring.
const wafers = [
  { slot: 1, diesS: Array.from({ length: 36 }, (_, i) => spread(1, i)) },
  { slot: 2, diesS: Array.from({ length: 49 }, (_, i) => (i % 11 === 3 ? 0.9e-6 : i % 13 === 5 ? 1.8e-6 : i % 17 === 7 ? 1e-13 : spread(2, i))) },
  { slot: 3, diesS: [1e-13, 1.31e-6, 1e-13, 1e-13] },
  { slot: 4, diesS: Array.from({ length: 400 }, (_, i) => (Math.hypot((i % 20) - 9.5, Math.floor(i / 20) - 9.5) > 7.5 ? 1e-13 : spread(4, i))) },
];

interface ApiDie { wafer: number; x: number; y: number; bin: Bin; conductanceS: number | null }

beforeAll(async () => {
  tenant = await createTestTenant(pool, "judge-summaries");
  await createSampleProduct(tenant, { ...GEOMETRY, ...SPEC, openBelowS: 1e-9 });
  const job = await ingestAndWait(tenant, probeFile(LOT, "VD-NW40", wafers));
  expect(job.status).toBe("done");
  lotId = (await pool.query("select id from lots where tenant_id = $1 and lot_number = $2", [tenant.id, LOT])).rows[0].id;
}, 60_000);
afterAll(() => pool.end());

const staff = (): Scope => ({ tenantId: tenant.id, userId: tenant.users.engineer!.id, role: "engineer", customerId: null, actorLabel: "engineer" });
async function apiDies(): Promise<ApiDie[]> {
  const { dies } = await (await api(tenant, "analyst", `/api/v1/lots/${LOT}/dies`)).json();
  return dies;
}

describe("die-level judging from summaries (§6)", () => {
  it("gives the capability the values give: X̄–S σ within over wafers of ≥ 2 parametric dies, overall σ of those dies", async () => {
    const dies = await apiDies();
    const parametric = dies.filter((d) => PARAMETRIC_BINS.includes(d.bin) && d.conductanceS !== null);
    const subgroups = [1, 2, 3, 4].map((w) => parametric.filter((d) => d.wafer === w).map((d) => d.conductanceS!)).filter((g) => g.length >= 2);
    expect(subgroups).toHaveLength(3);
    expect(new Set(subgroups.map((g) => g.length)).size).toBe(3); // unequal sizes: the pooled s̄
    const values = subgroups.flat();
    const expected = capability({ values, specLow: SPEC.specLowS, specHigh: SPEC.specHighS, withinSigma: xbarSChart(subgroups).withinSigma });

    const result = await withScope(staff(), (tx) => dieCapability(tx, [lotId], SPEC));
    expect(result.reason).toBeNull();
    const c = result.capability!;
    expect(c).toMatchObject({ dies: values.length, wafers: 3 });
    expect(c.sigmaNote).toContain("pooled s/c₄ within wafers over 3 wafers");
    expect(c.meanS / referenceMean(values)).toBeCloseTo(1, 12);
    expect(c.overallSigmaS / referenceSd(values)).toBeCloseTo(1, 10);
    expect(c.withinSigmaS / expected.withinSigma).toBeCloseTo(1, 10);
    for (const key of ["cp", "cpk", "pp", "ppk"] as const) expect(c[key]! / expected[key]!).toBeCloseTo(1, 9);
  });

  it("says why when no wafer has two measured dies or the product has no spec", async () => {
    expect(await withScope(staff(), (tx) => dieCapability(tx, [lotId], { specLowS: null, specHighS: null }))).toEqual({ capability: null, reason: "the product has no spec window" });
    const none = await withScope(staff(), (tx) => dieCapability(tx, ["00000000-0000-4000-8000-000000000000"], SPEC));
    expect(none).toEqual({ capability: null, reason: "fewer than 2 measured dies on any wafer" });
  });

  it("checks each wafer's edge against its centre as the domain's zones do, and finds the ring on wafer 4", async () => {
    const dies = await apiDies();
    const geometry = waferGeometry(GEOMETRY);
    const expected = [1, 2, 3, 4].map((wafer) => {
      const zones = zoneYields(assignZones(dies.filter((d) => d.wafer === wafer), geometry));
      const { edgeYield, centreYield, gap } = edgeVersusCentre(zones);
      return { wafer, edgeYield, centreYield, gap, edgeTested: zones.edge.tested, ring: gap !== null && gap >= EDGE_RING_MIN_GAP && zones.edge.tested >= EDGE_RING_MIN_EDGE_DIES };
    });
    const checks = await withScope(staff(), (tx) => edgeChecks(tx, lotId, GEOMETRY));
    expect(checks).toEqual(expected);
    expect(checks.map((c) => c.ring)).toEqual([false, false, false, true]);
  });
});
