import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, createSampleProduct, fixturePath } from "../src/test/ingest-helpers";
import { createTestTenant, ownerPool, TEST_PASSWORD, type TestTenant } from "../src/test/tenants";
import { plotRectPx } from "../src/components/charts/wafer-map-options";
import { mapLayout } from "../src/domain/wafer-map/layout";
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
    // The job list's lot cell turns into a link to the lot once the job is done, without a reload.
    await page.getByRole("grid").getByRole("link", { name: "TW2611-0147" }).waitFor({ timeout: 30_000 });
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
    // …and that many rings were actually painted on the map
    await expect.poll(() => map.getAttribute("data-flagged-drawn")).toBe(String(flagged));

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

  it("shows the die under the pointer in a tooltip, and a click on the map selects that die and opens its drawer", async () => {
    const { dies } = await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies?wafer=1")).json();
    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
    await signIn(page, tenant.users.analyst!.email, TEST_PASSWORD);
    await page.goto(`${appUrl}/lots/TW2611-0147?wafer=1`);
    const map = page.getByRole("application", { name: /Wafer map of wafer 1/ });
    await map.waitFor();
    await expect.poll(() => map.getAttribute("data-flagged-drawn")).not.toBeNull();
    await map.scrollIntoViewIfNeeded();
    const box = (await map.boundingBox())!;
    // Where the map draws each die: the layout in mm, then the plot's px (same modules as the map itself).
    const layout = mapLayout(dies, { dieWidthMm: 2, dieHeightMm: 2, waferDiameterMm: 150, edgeExclusionMm: 3 });
    const plot = plotRectPx("large", box.width, box.height);
    const half = layout.viewHalfSideMm;
    // Die (1, 1): it has a neighbour below, (1, 0), for the keyboard step.
    const index = dies.findIndex((d: { x: number; y: number }) => d.x === 1 && d.y === 1);
    const target = dies[index] as { x: number; y: number; bin: string };
    const rect = layout.rects[index]!;
    const px = box.x + plot.x + ((rect.centreXMm + half) / (2 * half)) * plot.width;
    const py = box.y + plot.y + ((half - rect.centreYMm) / (2 * half)) * plot.height;

    await page.mouse.move(px, py);
    const tip = map.getByRole("tooltip");
    await tip.getByText(`(${target.x}, ${target.y})`).waitFor();
    await tip.getByText(target.bin, { exact: true }).waitFor();
    await page.mouse.move(box.x + 2, box.y + 2); // off the wafer: no die, no tooltip
    await tip.waitFor({ state: "hidden" });

    await page.mouse.click(px, py);
    await page.waitForURL(new RegExp(`die=${target.x}%2C${target.y}|die=${target.x},${target.y}`));
    await expect.poll(() => map.getAttribute("data-selected")).toBe(`${target.x},${target.y}`);
    await page.getByRole("complementary", { name: `Die ${target.x}, ${target.y} of wafer 1` }).waitFor();

    // Keyboard: the cursor starts on the selected die and steps down to (1, 0); Escape hides its tooltip.
    await map.focus();
    await page.keyboard.press("ArrowDown");
    await tip.getByText("(1, 0)").waitFor();
    await page.keyboard.press("Escape");
    await tip.waitFor({ state: "hidden" });
  });

  it("exports the die table's rows as CSV with the §9 names, all of them or only those its filters leave", async () => {
    const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 }, acceptDownloads: true })).newPage();
    await signIn(page, tenant.users.analyst!.email, TEST_PASSWORD);
    await page.goto(`${appUrl}/lots/TW2611-0147?wafer=1`);
    const table = page.getByRole("region", { name: "Die table" });
    await table.getByText("3 dies", { exact: true }).waitFor();
    const save = async () => {
      const [download] = await Promise.all([page.waitForEvent("download"), table.getByRole("button", { name: "CSV of these dies" }).click()]);
      expect(download.suggestedFilename()).toBe("TW2611-0147-W1-dies.csv");
      const chunks: Buffer[] = [];
      for await (const chunk of (await download.createReadStream())!) chunks.push(chunk as Buffer);
      return Buffer.concat(chunks).toString("utf8");
    };
    // Unfiltered: byte for byte what the API's CSV export gives for the wafer.
    expect(await save()).toBe(await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies?wafer=1&format=csv")).text());

    // Filter the table to column x = 1: dies (1, 0) and (1, 1) of the wafer's three.
    await table.locator('[role="columnheader"][col-id="x"] .ag-header-cell-filter-button').click();
    await page.locator(".ag-filter-body input").first().fill("1");
    await table.getByText("2 of 3 dies match the filters").waitFor();
    const filtered = await save();
    expect(filtered.trim().split("\n")).toHaveLength(3);
    expect(filtered).toBe(await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies?wafer=1&x=1&format=csv")).text());
  });

  it("answers another tenant's lot with the 404 page (threat: reading a competitor's lot by URL)", async () => {
    const other = await createTestTenant(pool, "e2e-lot-other");
    const page = await (await browser.newContext()).newPage();
    await signIn(page, other.users.admin!.email, TEST_PASSWORD);
    const response = await page.goto(`${appUrl}/lots/TW2611-0147`);
    expect(response?.status()).toBe(404);
  });
});
