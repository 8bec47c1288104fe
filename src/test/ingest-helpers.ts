// Helpers for tests that push probe files through the real API and worker.
import { readFileSync } from "node:fs";
import path from "node:path";
import { appUrl, type TestTenant } from "./tenants";

export const fixturePath = (name: string) => path.resolve(__dirname, "../../fixtures/probe", name);
export const fixture = (name: string) => readFileSync(fixturePath(name));

export async function api(tenant: TestTenant, role: string, pathAndQuery: string, init: RequestInit = {}): Promise<Response> {
  return fetch(`${appUrl}${pathAndQuery}`, { ...init, headers: { authorization: `Bearer ${tenant.keys[role]}`, ...(init.headers ?? {}) } });
}

/** The VD-NW40 product of the sample files, with spec limits around their 1.2–1.7 µS. */
export async function createSampleProduct(tenant: TestTenant, overrides: Record<string, unknown> = {}): Promise<void> {
  const response = await api(tenant, "engineer", "/api/v1/products", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({
      code: "VD-NW40", name: "Nanowire array 40", customerId: tenant.customers[0]!.id, dieWidthMm: 2, dieHeightMm: 2, waferDiameterMm: 150,
      edgeExclusionMm: 3, specLowS: 1.0e-6, specHighS: 1.65e-6, ...overrides,
    }),
  });
  if (response.status !== 201) throw new Error(`product: ${response.status} ${await response.text()}`);
}

export async function upload(tenant: TestTenant, content: Buffer | string, query = "", role = "engineer"): Promise<Response> {
  const body = typeof content === "string" ? content : new Uint8Array(content);
  return api(tenant, role, `/api/v1/lots/ingest${query}`, { method: "POST", headers: { "content-type": "text/csv" }, body });
}

export interface JobBody {
  id: string;
  status: string;
  progress: number;
  lot: string | null;
  warnings: { line: number; message: string }[];
  error: { line: number | null; message: string; code: string | null } | null;
  report: { dies: number; rows: number; ignoredColumns: string[]; wafers: number[]; bins: Record<string, number> } | null;
}

export async function waitForJob(tenant: TestTenant, id: string, timeoutMs = 60_000): Promise<JobBody> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const job = (await (await api(tenant, "analyst", `/api/v1/jobs/${id}`)).json()) as JobBody;
    if (job.status === "done" || job.status === "failed") return job;
    if (Date.now() > deadline) throw new Error(`job ${id} still ${job.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

export async function ingestAndWait(tenant: TestTenant, body: Buffer | string, query = ""): Promise<JobBody> {
  const response = await upload(tenant, body, query);
  if (response.status !== 202 && response.status !== 200) throw new Error(`ingest: ${response.status} ${await response.text()}`);
  const { job } = (await response.json()) as { job: JobBody };
  return waitForJob(tenant, job.id);
}
