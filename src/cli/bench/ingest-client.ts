// The benchmark's client side of the public API (§9): a fresh tenant and product, a streamed upload, job polling.
import { createReadStream, statSync } from "node:fs";
import http from "node:http";
import pg from "pg";
import type { JobView } from "@/lib/schemas/ingest";
import { createTestTenant, type TestTenant } from "@/test/tenants";

export interface BenchTenant {
  appUrl: string;
  tenant: TestTenant;
}

async function call(t: BenchTenant, role: string, pathAndQuery: string, init: RequestInit = {}): Promise<Response> {
  return fetch(`${t.appUrl}${pathAndQuery}`, { ...init, headers: { authorization: `Bearer ${t.tenant.keys[role]}`, ...(init.headers ?? {}) } });
}

/** A tenant made the way the tests make theirs (as the schema owner), with the product the bench files name. */
export async function createBenchTenant(ownerUrl: string, appUrl: string, product: string): Promise<BenchTenant> {
  const pool = new pg.Pool({ connectionString: ownerUrl, max: 2 });
  try {
    const t: BenchTenant = { appUrl, tenant: await createTestTenant(pool, "bench") };
    const response = await call(t, "engineer", "/api/v1/products", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({
        code: product, name: "Benchmark nanowire array", customerId: t.tenant.customers[0]!.id, dieWidthMm: 0.5, dieHeightMm: 0.5,
        waferDiameterMm: 150, edgeExclusionMm: 3, specLowS: 1.0e-6, specHighS: 1.65e-6, openBelowS: 1e-9, shortAboveS: 1e-4, dieWindow: "pat",
      }),
    });
    if (response.status !== 201) throw new Error(`creating product ${product}: HTTP ${response.status} ${await response.text()}`);
    return t;
  } finally {
    await pool.end();
  }
}

/** POST /api/v1/lots/ingest with the file streamed from disk as text/csv; resolves with the job once the app answers. */
export function uploadFile(t: BenchTenant, path: string): Promise<JobView> {
  const url = new URL("/api/v1/lots/ingest", t.appUrl);
  return new Promise((resolve, reject) => {
    const request = http.request(url, {
      method: "POST",
      headers: { authorization: `Bearer ${t.tenant.keys.engineer}`, "content-type": "text/csv", "content-length": statSync(path).size },
    });
    request.on("response", (response) => {
      const chunks: Buffer[] = [];
      response.on("data", (c: Buffer) => chunks.push(c));
      response.on("end", () => {
        const text = Buffer.concat(chunks).toString("utf8");
        if (response.statusCode !== 202) reject(new Error(`upload answered HTTP ${response.statusCode}: ${text.slice(0, 500)}`));
        else resolve((JSON.parse(text) as { job: JobView }).job);
      });
      response.on("error", reject);
    });
    request.on("error", reject);
    const file = createReadStream(path, { highWaterMark: 1 << 20 });
    file.on("error", (e) => request.destroy(e));
    file.pipe(request);
  });
}

export async function getJob(t: BenchTenant, id: string): Promise<JobView> {
  const response = await call(t, "analyst", `/api/v1/jobs/${id}`);
  if (!response.ok) throw new Error(`GET /api/v1/jobs/${id}: HTTP ${response.status}`);
  return (await response.json()) as JobView;
}

/** Polls the job every `intervalMs` until done or failed; `onPoll` sees every state (for a timeline). */
export async function waitForJob(t: BenchTenant, id: string, timeoutMs: number, intervalMs = 100, onPoll?: (job: JobView) => void): Promise<JobView> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const job = await getJob(t, id);
    onPoll?.(job);
    if (job.status === "done" || job.status === "failed") return job;
    if (Date.now() > deadline) throw new Error(`job ${id} still ${job.status} (progress ${job.progress}) after ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, intervalMs));
  }
}

/**
 * After `done` the app judges the lot (SPC rules, yield floor, edge ring, capability) and then adds `spc` to the
 * job's report; polls until it is there, or null when it does not come within `timeoutMs` (judging failed).
 */
export async function waitForJudging(t: BenchTenant, id: string, timeoutMs: number, intervalMs = 250): Promise<JobView | null> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const job = await getJob(t, id);
    if (job.report && "spc" in job.report) return job;
    if (Date.now() > deadline) return null;
    await new Promise((r) => setTimeout(r, intervalMs));
  }
}
