import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, createSampleProduct, fixture, ingestAndWait } from "@/test/ingest-helpers";
import { createTestTenant, ownerPool, type TestTenant } from "@/test/tenants";

const pool = ownerPool();
let tenant: TestTenant;

beforeAll(async () => {
  tenant = await createTestTenant(pool, "report");
  await createSampleProduct(tenant);
  await ingestAndWait(tenant, fixture("good-small.csv"));
});
afterAll(() => pool.end());

/** Text of every page, extracted by PDF.js (an independent reader). */
async function pdfText(bytes: Uint8Array): Promise<string> {
  const pdf = await getDocument({ data: bytes }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= pdf.numPages; i++) pages.push((await (await pdf.getPage(i)).getTextContent()).items.map((item) => ("str" in item ? item.str : "")).join(" "));
  return pages.join("\n");
}

const release = () => pool.query("update lots set status = 'released', released_at = now() where tenant_id = $1 and lot_number = 'TW2611-0147'", [tenant.id]);

describe("the customer lot report (JSON and PDF)", () => {
  it("hides an unreleased lot from its own customer with 404 (threat: reading a lot before release)", async () => {
    expect((await api(tenant, "customer", "/api/v1/lots/TW2611-0147/report")).status).toBe(404);
    expect((await api(tenant, "customer", "/api/v1/lots/TW2611-0147")).status).toBe(404);
  });

  it("gives the same yield in JSON and in the PDF's text, with page numbers and the tenant's name", async () => {
    await release();
    const json = await (await api(tenant, "customer", "/api/v1/lots/TW2611-0147/report")).json();
    // good-small: 6 dies, the 1.7 µS one above specHigh 1.65 µS is HIGH: 5/6 pass.
    expect(json).toMatchObject({ lot: "TW2611-0147", tested: 6, pass: 5, status: "released" });
    const response = await api(tenant, "customer", "/api/v1/lots/TW2611-0147/report?format=pdf");
    expect(response.headers.get("content-type")).toBe("application/pdf");
    const bytes = new Uint8Array(await response.arrayBuffer());
    expect(Buffer.from(bytes.subarray(0, 5)).toString()).toBe("%PDF-");
    const text = await pdfText(bytes);
    expect(text).toContain("Lot TW2611-0147");
    expect(text).toContain("83.3 %"); // 5/6, as formatted on the page
    expect(text).toContain(tenant.name);
    expect(text).toMatch(/Page 1 of \d/);
  });

  it("keeps internals out of the customer's report: no control limits, die windows, raw files or other customers", async () => {
    await release();
    const body = JSON.stringify(await (await api(tenant, "customer", "/api/v1/lots/TW2611-0147/report?include=maps")).json());
    for (const word of ["windowLowS", "windowHighS", "outOfWindow\":true", "rawFile", "sha256", "excursion", "comment", tenant.customers[1]!.name]) expect(body).not.toContain(word);
  });

  it("answers the other customer of the same tenant with 404 (threat: one customer reading another's lot)", async () => {
    await release();
    expect((await api(tenant, "customer2", "/api/v1/lots/TW2611-0147/report")).status).toBe(404);
    expect((await api(tenant, "customer2", "/api/v1/lots?pageSize=10")).status).toBe(200);
    const list = await (await api(tenant, "customer2", "/api/v1/lots")).json();
    expect(list.lots).toEqual([]);
  });
});
