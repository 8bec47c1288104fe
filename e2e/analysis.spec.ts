import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, createSampleProduct, fixture, ingestAndWait } from "../src/test/ingest-helpers";
import { createTestTenant, ownerPool, TEST_PASSWORD, type TestTenant } from "../src/test/tenants";
import { appUrl, launchBrowser } from "./browser";

interface ApiDie {
  wafer: number;
  x: number;
  y: number;
  bin: string;
  conductanceS: number | null;
}
interface ApiLot {
  tested: number;
  bins: Record<string, number>;
  wafers: { wafer: number; tested: number; pass: number; yield: number | null }[];
}

const LOT = "TW2611-0147";
let browser: Browser;
let tenant: TestTenant;
let lot: ApiLot;
let dies: ApiDie[];
const pool = ownerPool();

beforeAll(async () => {
  browser = await launchBrowser();
  tenant = await createTestTenant(pool, "e2e-analysis");
  await createSampleProduct(tenant);
  const job = await ingestAndWait(tenant, fixture("good-small.csv"));
  if (job.status !== "done") throw new Error(`ingest failed: ${JSON.stringify(job.error)}`);
  lot = (await (await api(tenant, "analyst", `/api/v1/lots/${LOT}`)).json()) as ApiLot;
  dies = ((await (await api(tenant, "analyst", `/api/v1/lots/${LOT}/dies`)).json()) as { dies: ApiDie[] }).dies;
});
afterAll(async () => {
  await browser?.close();
  await pool.end();
});

async function openLot(): Promise<{ page: Page; analysis: Locator }> {
  const page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
  await page.goto(`${appUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(tenant.users.analyst!.email);
  await page.getByLabel("Password").fill(TEST_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${appUrl}/`);
  await page.goto(`${appUrl}/lots/${LOT}?wafer=1`);
  const analysis = page.getByRole("region", { name: `Analysis of lot ${LOT}` });
  await analysis.waitFor();
  return { page, analysis };
}

/** The cells of the table row whose first cell reads `label`. */
async function rowCells(table: Locator, label: string): Promise<string[]> {
  const row = table.getByRole("row").filter({ has: table.page().getByRole("cell", { name: label, exact: true }) }).first();
  return row.getByRole("cell").allInnerTexts();
}

describe("the lot page's analysis tabs (browser)", () => {
  it("shows each view with numbers that agree with the API, and moves between tabs with the arrow keys", async () => {
    const { page, analysis } = await openLot();

    // Stacked map: one cell per die position found on any wafer.
    const positions = new Set(dies.map((d) => `${d.x},${d.y}`)).size;
    const stacked = analysis.getByRole("img", { name: /Stacked fail map over 2 wafers/ });
    await stacked.waitFor();
    expect(Number(await stacked.getAttribute("data-cell-count"))).toBe(positions);

    // Radial zones: the lot row's zones together hold every tested die.
    await analysis.getByRole("tab", { name: "Radial zones" }).click();
    const zones = analysis.getByRole("table", { name: "Radial zone yield" });
    await zones.waitFor();
    const lotZones = await rowCells(zones, "Lot");
    const inZones = lotZones.slice(1, 4).reduce((sum, text) => sum + Number(/\/(\d+)\)/.exec(text)?.[1] ?? 0), 0);
    expect(inZones + Number(lotZones[4])).toBe(lot.tested);

    // Bin Pareto: every failing bin of the lot with the API's count.
    await analysis.getByRole("tab", { name: "Bin Pareto" }).click();
    const failing = Object.entries(lot.bins).filter(([bin, n]) => bin !== "PASS" && n > 0);
    await analysis.getByRole("region", { name: "Bin Pareto of the lot" }).waitFor();
    if (failing.length === 0) {
      await analysis.getByText("No failing dies: every tested die is PASS.").first().waitFor();
    } else {
      const table = analysis.getByRole("table", { name: "Failing bins of the lot" });
      for (const [bin, n] of failing) expect((await rowCells(table, bin))[1]).toBe(String(n));
    }

    // Wafer comparison: the dies counted per wafer are its parametric dies.
    await analysis.getByRole("tab", { name: "Wafer comparison" }).click();
    const spreads = analysis.getByRole("table", { name: "Conductance median and IQR per wafer" });
    await spreads.waitFor();
    const parametric = dies.filter((d) => d.wafer === 1 && ["PASS", "LOW", "HIGH", "NONLINEAR"].includes(d.bin) && d.conductanceS !== null).length;
    expect((await rowCells(spreads, "W1"))[1]).toBe(String(parametric));

    // Defect density: dies probed per wafer and the mean of the wafer yields.
    await analysis.getByRole("tab", { name: "Defect density" }).click();
    const used = analysis.getByRole("table", { name: "Wafer yields used and dies probed" });
    await used.waitFor();
    for (const w of lot.wafers) expect((await rowCells(used, `W${w.wafer}`))[1]).toBe(String(w.tested));
    const meanYield = lot.wafers.reduce((sum, w) => sum + w.pass / w.tested, 0) / lot.wafers.length;
    await analysis.getByText(`${(100 * meanYield).toFixed(2)} %`, { exact: true }).waitFor();
    expect(new URL(page.url()).searchParams.get("analysis")).toBe("defects");

    // Keyboard: ArrowRight from the last tab wraps to the first and takes the focus with it.
    await analysis.getByRole("tab", { name: "Defect density" }).focus();
    await page.keyboard.press("ArrowRight");
    const first = analysis.getByRole("tab", { name: "Stacked map" });
    await expect.poll(() => first.getAttribute("aria-selected")).toBe("true");
    expect(await first.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.keyboard.press("End");
    await expect.poll(() => analysis.getByRole("tab", { name: "Defect density" }).getAttribute("aria-selected")).toBe("true");
  });
});
