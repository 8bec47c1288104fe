import type { Browser } from "playwright-core";
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, createSampleProduct, fixture, ingestAndWait } from "../src/test/ingest-helpers";
import { createTestTenant, ownerPool, TEST_PASSWORD, type TestTenant } from "../src/test/tenants";
import { appUrl, launchBrowser, signIn } from "./browser";

let browser: Browser;
let tenant: TestTenant;
const pool = ownerPool();

/** Two lots of customer A (one released, one not) and one released lot of customer B. */
beforeAll(async () => {
  browser = await launchBrowser();
  tenant = await createTestTenant(pool, "e2e-portal");
  await createSampleProduct(tenant);
  await api(tenant, "engineer", "/api/v1/products", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ code: "OTHER-1", name: "Other customer's part", customerId: tenant.customers[1]!.id, dieWidthMm: 2, dieHeightMm: 2, waferDiameterMm: 150 }),
  });
  const good = fixture("good-small.csv").toString();
  await ingestAndWait(tenant, good);
  await ingestAndWait(tenant, good.replace("TW2611-0147", "TW2611-0148"));
  await ingestAndWait(tenant, good.replace("TW2611-0147", "OT2611-0001").replace("VD-NW40", "OTHER-1"));
  await pool.query("update lots set status = 'released', released_at = now() where tenant_id = $1 and lot_number in ('TW2611-0147', 'OT2611-0001')", [tenant.id]);
});
afterAll(async () => {
  await browser?.close();
  await pool.end();
});


describe("the customer portal in a real browser", () => {
  it("shows a customer exactly its released lots, opens the report and downloads its PDF", async () => {
    const context = await browser.newContext({ acceptDownloads: true, viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, tenant.users.customer!.email, TEST_PASSWORD);
    await page.getByRole("heading", { name: "Your released lots" }).waitFor();
    const rows = page.getByRole("row");
    await expect.poll(() => rows.count()).toBe(2); // header + one released lot
    expect(await page.getByText("TW2611-0148").count()).toBe(0); // not released
    expect(await page.getByText("OT2611-0001").count()).toBe(0); // another customer's
    expect(await page.getByRole("link", { name: "Uploads" }).count()).toBe(0);

    await page.getByRole("link", { name: "Lot report" }).click();
    await page.getByRole("heading", { name: "Lot TW2611-0147" }).waitFor();
    await page.getByText("83.3 % (5/6)").first().waitFor();
    for (const internal of ["Out of window", "control limit", "Excursion", "sha256"]) expect(await page.getByText(internal).count()).toBe(0);

    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Download PDF" }).click()]);
    const bytes = new Uint8Array(await (await import("node:fs/promises")).readFile((await download.path())!));
    expect(Buffer.from(bytes.subarray(0, 5)).toString()).toBe("%PDF-");
    const pdf = await getDocument({ data: bytes }).promise;
    const text = (await (await pdf.getPage(1)).getTextContent()).items.map((i) => ("str" in i ? i.str : "")).join(" ");
    expect(text).toContain("TW2611-0147");
    expect(text).toContain("83.3 %");
    await context.close();
  });

  it("answers another customer's lot, an unreleased lot and a staff page with the 404 page (threat: URL guessing)", async () => {
    const page = await (await browser.newContext()).newPage();
    await signIn(page, tenant.users.customer!.email, TEST_PASSWORD);
    for (const path of ["/lots/OT2611-0001/report", "/lots/TW2611-0148/report", "/lots/TW2611-0147", "/uploads"]) {
      const response = await page.goto(`${appUrl}${path}`);
      expect(response?.status(), path).toBe(404);
    }
  });
});
