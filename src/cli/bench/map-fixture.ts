// The data `npm run bench:map` measures: a fresh tenant, one product per wafer size on a 200 mm wafer, and one
// single-wafer lot per size loaded through the real ingest API and worker.
import pg from "pg";
import { createTestTenant, type TestTenant } from "../../test/tenants";
import { benchDieSideMm, benchLotCsv, benchWafer, type BenchWafer } from "./map-wafer-csv";

const WAFER_DIAMETER_MM = 200;
const EDGE_EXCLUSION_MM = 3;

export interface BenchLot {
  dieCount: number;
  lot: string;
  product: string;
  dieSideMm: number;
  wafer: BenchWafer;
  /** Wall time of upload to job done, ms (context only: the ingest benchmark owns these figures). */
  ingestMs: number;
}

export interface BenchFixture {
  tenant: TestTenant;
  lots: Map<number, BenchLot>;
}

async function call(appUrl: string, key: string, pathAndQuery: string, init: RequestInit = {}): Promise<Response> {
  return fetch(`${appUrl}${pathAndQuery}`, { ...init, headers: { authorization: `Bearer ${key}`, ...(init.headers ?? {}) } });
}

async function waitForJob(appUrl: string, key: string, id: string, timeoutMs: number): Promise<{ status: string; error: unknown; report: { dies: number } | null }> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const job = (await (await call(appUrl, key, `/api/v1/jobs/${id}`)).json()) as { status: string; error: unknown; report: { dies: number } | null };
    if (job.status === "done" || job.status === "failed") return job;
    if (Date.now() > deadline) throw new Error(`ingest job ${id} still ${job.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

async function loadLot(appUrl: string, tenant: TestTenant, dieCount: number): Promise<BenchLot> {
  const engineer = tenant.keys.engineer!;
  const product = `BM-${dieCount}`;
  const lot = `BM${dieCount}-01`;
  const dieSideMm = benchDieSideMm(dieCount, WAFER_DIAMETER_MM, EDGE_EXCLUSION_MM);
  const created = await call(appUrl, engineer, "/api/v1/products", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({
      code: product, name: `Bench map ${dieCount} dies`, customerId: tenant.customers[0]!.id, dieWidthMm: dieSideMm, dieHeightMm: dieSideMm,
      waferDiameterMm: WAFER_DIAMETER_MM, edgeExclusionMm: EDGE_EXCLUSION_MM, specLowS: 1.0e-6, specHighS: 1.6e-6, displayUnit: "uS",
    }),
  });
  if (created.status !== 201) throw new Error(`product ${product}: ${created.status} ${await created.text()}`);
  const wafer = benchWafer(dieCount);
  const started = performance.now();
  const uploaded = await call(appUrl, engineer, "/api/v1/lots/ingest", { method: "POST", headers: { "content-type": "text/csv" }, body: benchLotCsv(lot, product, wafer, dieCount) });
  if (uploaded.status !== 202) throw new Error(`ingest of ${lot}: ${uploaded.status} ${await uploaded.text()}`);
  const { job } = (await uploaded.json()) as { job: { id: string } };
  const done = await waitForJob(appUrl, engineer, job.id, 300_000);
  if (done.status !== "done" || done.report?.dies !== dieCount) throw new Error(`ingest of ${lot} ended ${done.status}: ${JSON.stringify(done.error ?? done.report)}`);
  return { dieCount, lot, product, dieSideMm, wafer, ingestMs: performance.now() - started };
}

/** Makes the tenant (as the schema owner, like the tests) and loads one lot per die count, in order. */
export async function loadBenchFixture(appUrl: string, ownerUrl: string, dieCounts: readonly number[]): Promise<BenchFixture> {
  const pool = new pg.Pool({ connectionString: ownerUrl, max: 2 });
  let tenant: TestTenant;
  try {
    tenant = await createTestTenant(pool, "bench-map");
  } finally {
    await pool.end();
  }
  const lots = new Map<number, BenchLot>();
  for (const n of dieCounts) lots.set(n, await loadLot(appUrl, tenant, n));
  return { tenant, lots };
}
