import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, createSampleProduct, fixturePath } from "../src/test/ingest-helpers";
import { createTestTenant, ownerPool, TEST_PASSWORD, type TestTenant } from "../src/test/tenants";
import { appUrl, launchBrowser, signIn } from "./browser";

let browser: Browser;
let tenant: TestTenant;
const pool = ownerPool();

beforeAll(async () => {
  browser = await launchBrowser();
  tenant = await createTestTenant(pool, "e2e-lot");
  // A narrow die window (k = 0.5) so the small sample wafer has out-of-window dies to flag.
  await createSampleProduct(tenant, { dieWindow: "pat", dieWindowK: 0.5, specHighS: 2e-6 });
});
afterAll(async () => {
  await browser?.close();
  await pool.end();
});


describe("upload a lot, watch it finish, explore its wafer map (browser)", () => {
  it("uploads a probe file by the drop zone and shows the job done with its lot", async () => {
    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
    await signIn(page, tenant.users.engineer!.email, TEST_PASSWORD);
    await page.getByRole("link", { name: "Uploads" }).click();
    await page.waitForURL(`${appUrl}/uploads`);
    await page.locator('input[type="file"]').setInputFiles(fixturePath("good-small.csv"));
    await page.getByText(/Done: lot TW2611-0147, 6 dies on 2 wafers/).waitFor({ timeout: 60_000 });
  });

  it("draws exactly the API's out-of-window dies as flagged, and a die picked in the table is selected on the map with its drawer open", async () => {
    const { dies } = await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies?wafer=1")).json();
    const flagged = dies.filter((d: { outOfWindow: boolean }) => d.outOfWindow).length;
    expect(flagged).toBeGreaterThan(0);

    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
    await signIn(page, tenant.users.analyst!.email, TEST_PASSWORD);
    await page.goto(`${appUrl}/lots/TW2611-0147?wafer=1`);
    const map = page.getByRole("application", { name: /Wafer map of wafer 1/ });
    await map.waitFor();
    expect(Number(await map.getAttribute("data-die-count"))).toBe(dies.length);
    expect(Number(await map.getAttribute("data-flagged-count"))).toBe(flagged);

    const target = dies[1] as { x: number; y: number; bin: string };
    const table = page.getByRole("region", { name: "Dies of the selected wafer" });
    const row = table.getByRole("row").filter({ hasText: target.bin }).filter({ has: page.getByRole("gridcell", { name: String(target.x), exact: true }) }).first();
    await row.click();
    await page.waitForURL(/die=/);
    const [x, y] = new URL(page.url()).searchParams.get("die")!.split(",").map(Number);
    await expect.poll(() => map.getAttribute("data-selected")).toBe(`${x},${y}`);
    const drawer = page.getByRole("complementary", { name: `Die ${x}, ${y} of wafer 1` });
    await drawer.waitFor();
    await drawer.getByText("Conductance G").waitFor();
    await drawer.getByText(/inside the thermal window|beyond the thermal window/).waitFor();
  });

  it("answers another tenant's lot with the 404 page (threat: reading a competitor's lot by URL)", async () => {
    const other = await createTestTenant(pool, "e2e-lot-other");
    const page = await (await browser.newContext()).newPage();
    await signIn(page, other.users.admin!.email, TEST_PASSWORD);
    const response = await page.goto(`${appUrl}/lots/TW2611-0147`);
    expect(response?.status()).toBe(404);
  });
});
