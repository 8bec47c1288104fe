import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { limitSetFromBaseline } from "../src/domain/spc";
import { api, ingestAndWait, type JobBody } from "../src/test/ingest-helpers";
import { ninesAround, probeFile } from "../src/test/spc-files";
import { createTestTenant, ownerPool, TEST_PASSWORD, type TestTenant } from "../src/test/tenants";
import { appUrl, launchBrowser, signIn } from "./browser";
import { firstLink, waitForMessage } from "./mailbox";

// Issue 6's "done when", in the browser: freeze limits, upload a shifted lot, see the excursion and the e-mail, hold
// the lot, resolve, release. The lots are those of src/server/spc/spc.db.test.ts: 20 stable lots of 3 wafers at
// G0·(1 + A·z), z = 1, 0, −1, then lots shifted by +1.5σ̂, where Western Electric rule 3 first completes on the
// second shifted lot.
const PRODUCT = "SPC-LOOP";
const G0 = 1.5e-6;
const A = 0.02;
const PATTERN = [1, 0, -1];
const BASELINE = Array.from({ length: 20 }, (_, i) => `BASE-${String(i + 1).padStart(2, "0")}`);

let browser: Browser;
let tenant: TestTenant;
let page: Page;
let sigmaS = 0;
let excursion = { id: "", number: 0, lots: [] as string[] };
const pool = ownerPool();

const json = (body: unknown): RequestInit => ({ method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
const lotStatus = async (lot: string) => (await (await api(tenant, "analyst", `/api/v1/lots/${lot}`)).json()).status as string;
const excursions = async () =>
  (await (await api(tenant, "analyst", `/api/v1/excursions?product=${PRODUCT}`)).json()).excursions as { id: string; number: number; lots: string[]; status: string; trigger: string }[];
const panel = (title: string): Locator => page.locator("section").filter({ has: page.getByRole("heading", { name: title, exact: true }) });
const shiftedLot = (n: number) => probeFile(`SHIFT-${n}`, PRODUCT, [1, 2, 3].map((slot) => ({ slot, diesS: ninesAround(G0 + 1.5 * sigmaS) })));

/** Waits until the SPC judging after the commit has written its outcome into the lot's job report. */
async function judgedOutcomes(lot: string): Promise<string[]> {
  const deadline = Date.now() + 30_000;
  for (;;) {
    const { jobs } = (await (await api(tenant, "analyst", "/api/v1/jobs?limit=50")).json()) as { jobs: (JobBody & { report: { spc?: { excursions: { outcome: string }[] } } | null })[] };
    const spc = jobs.find((j) => j.lot === lot && j.status === "done")?.report?.spc;
    if (spc) return spc.excursions.map((e) => e.outcome);
    if (Date.now() > deadline) throw new Error(`lot ${lot} was never judged`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

beforeAll(async () => {
  browser = await launchBrowser();
  tenant = await createTestTenant(pool, "e2e-spc");
  const created = await api(tenant, "engineer", "/api/v1/products", json({
    code: PRODUCT, name: "SPC loop", customerId: tenant.customers[0]!.id, dieWidthMm: 5, dieHeightMm: 5, waferDiameterMm: 150,
    specLowS: 0.5e-6, specHighS: 3e-6, yieldFloor: 0.5, rules: "western-electric", dieWindow: "static",
  }));
  expect(created.status).toBe(201);
  // Bulk set-up through the API: the 20 baseline lots.
  for (const lot of BASELINE) {
    const wafers = PATTERN.map((z, i) => ({ slot: i + 1, diesS: ninesAround(G0 * (1 + A * z)) }));
    expect((await ingestAndWait(tenant, probeFile(lot, PRODUCT, wafers))).status).toBe("done");
  }
  page = await (await browser.newContext({ viewport: { width: 1440, height: 900 } })).newPage();
  await signIn(page, tenant.users.engineer!.email, TEST_PASSWORD);
}, 180_000);
afterAll(async () => {
  await browser?.close();
  await pool.end();
});

describe("the engineer's SPC loop in the browser: freeze → shifted lot → excursion and e-mail → hold → resolve → release (issue 6)", () => {
  it("reviews the 20 baseline lots and freezes them as limits version 1", async () => {
    await page.goto(`${appUrl}/products/${PRODUCT}`);
    await page.getByText(`No limits are frozen for ${PRODUCT} yet`).waitFor();
    const freeze = panel("Freeze new limits");
    await freeze.getByLabel("Lots", { exact: true }).fill(BASELINE.join(", "));
    await freeze.getByLabel("Note", { exact: true }).fill("first baseline");
    await freeze.getByRole("button", { name: "Compute for review" }).click();
    await freeze.getByText("20 lots, 60 wafers, 540 measured dies.").waitFor();
    await freeze.getByText(/Normality hint \(wafer medians, Jarque–Bera\)/).waitFor();
    await freeze.getByRole("button", { name: "Freeze as the next version" }).click();
    await freeze.getByRole("status").filter({ hasText: "Frozen as version 1." }).waitFor();

    await page.reload();
    await page.getByRole("heading", { name: "Control charts · limits version 1" }).waitFor();
    const versions = (await (await api(tenant, "analyst", `/api/v1/products/${PRODUCT}/limits`)).json()).versions;
    expect(versions.map((v: { version: number }) => v.version)).toEqual([1]);
    sigmaS = versions[0].limits.waferMedianConductanceS.individuals.sigma;
    const expected = limitSetFromBaseline(BASELINE.map(() => PATTERN.map((z) => ({ medianConductanceS: G0 * (1 + A * z), yieldFraction: 1 }))));
    // Fitted G from 12-digit currents: a relative 1e-4 covers the print rounding (as in spc.db.test.ts).
    expect(Math.abs(sigmaS / expected.waferMedianConductanceS.individuals.sigma - 1)).toBeLessThan(1e-4);
  });

  it("puts the engineer on the product's watch list with the watch button", async () => {
    const watch = panel("Watch list");
    await watch.getByText(/Nobody yet/).waitFor();
    await watch.getByRole("button", { name: "Watch this product" }).click();
    await watch.getByRole("button", { name: "Stop watching" }).waitFor();
    await watch.getByText(`engineer ${tenant.slug.split("-").pop()}`).waitFor();
  });

  it("uploads shifted lots on the uploads page until a control-rule excursion opens, at the second one", async () => {
    await page.getByRole("link", { name: "Uploads" }).click();
    await page.waitForURL(`${appUrl}/uploads`);
    let opened: string | null = null;
    for (let n = 1; n <= 4 && !opened; n++) {
      await page.locator('input[type="file"]').setInputFiles({ name: `shift-${n}.csv`, mimeType: "text/csv", buffer: Buffer.from(shiftedLot(n)) });
      await page.getByText(`Done: lot SHIFT-${n}, 27 dies on 3 wafers`).waitFor({ timeout: 60_000 });
      if ((await judgedOutcomes(`SHIFT-${n}`)).includes("opened")) opened = `SHIFT-${n}`;
    }
    expect(opened).toBe("SHIFT-2");
    const list = await excursions();
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ trigger: "rule", status: "open", lots: ["SHIFT-2"] });
    excursion = list[0]!;
  });

  it("lists the excursion on /excursions, opens it with its findings, and has e-mailed the watching engineer its link", async () => {
    await page.getByRole("link", { name: "Excursions" }).first().click();
    await page.waitForURL(`${appUrl}/excursions`);
    const grid = page.getByRole("region", { name: "Excursions" });
    const row = grid.getByRole("row").filter({ hasText: "SHIFT-2" });
    await row.getByText("open", { exact: true }).waitFor();
    await row.getByRole("gridcell", { name: "Control rule", exact: true }).waitFor();
    await row.getByRole("link", { name: String(excursion.number), exact: true }).click();
    await page.waitForURL(`${appUrl}/excursions/${excursion.number}`);
    await page.getByText(`Excursion ${excursion.number} · ${PRODUCT} · Control rule`).waitFor();
    const linked = panel("Linked lots and wafers");
    await linked.getByRole("link", { name: "SHIFT-2" }).waitFor();
    await linked.getByText("WE3", { exact: true }).first().waitFor();
    await page.getByRole("img", { name: `Control chart for excursion ${excursion.number}` }).waitFor();

    const mail = await waitForMessage(tenant.users.engineer!.email, `Excursion ${excursion.number}:`, 30_000);
    expect(mail.text).toContain("SHIFT-2");
    const link = firstLink(mail, "/excursions/");
    expect(new URL(link).pathname).toBe(`/excursions/${excursion.number}`);
    // The watch list is not empty, so the admin gets nothing.
    await expect(waitForMessage(tenant.users.admin!.email, `Excursion ${excursion.number}:`, 1_000)).rejects.toThrow(/no message/);
    await page.goto(link);
    await page.getByRole("heading", { name: "State" }).waitFor();
  });

  it("holds the lot on its page, then refuses its release while the excursion is open", async () => {
    await page.goto(`${appUrl}/lots/SHIFT-2`);
    const disposition = panel("Disposition");
    await disposition.getByText("Open excursions on this lot").waitFor();
    await disposition.getByLabel("Disposition", { exact: true }).selectOption("hold");
    await disposition.getByLabel("Reason", { exact: true }).fill("shifted G under review");
    await disposition.getByRole("button", { name: "Put on hold" }).click();
    await disposition.getByRole("status").filter({ hasText: "Lot is now on hold." }).waitFor();
    expect(await lotStatus("SHIFT-2")).toBe("on hold");

    await page.reload();
    await disposition.getByLabel("Disposition", { exact: true }).selectOption("release");
    await disposition.getByLabel("Override reason (open excursion)").waitFor();
    await disposition.getByLabel("Reason", { exact: true }).fill("looks fine");
    await disposition.getByRole("button", { name: "Release to the customer" }).click();
    await disposition.getByRole("alert").filter({ hasText: `open excursion(s) (${excursion.number}): give an override reason` }).waitFor();
    expect(await lotStatus("SHIFT-2")).toBe("on hold");
  });

  it("acknowledges the excursion, then resolves it with a root cause and a note", async () => {
    await page.goto(`${appUrl}/excursions/${excursion.number}`);
    const state = panel("State");
    await state.getByRole("button", { name: "Acknowledge" }).click();
    await state.getByRole("button", { name: "Acknowledge" }).waitFor({ state: "detached" });
    await page.getByText("acknowledged", { exact: true }).first().waitFor();
    expect((await excursions())[0]!.status).toBe("acknowledged");

    // No root cause: refused, with the field marked.
    await state.getByRole("button", { name: "Resolve the excursion" }).click();
    await state.getByRole("alert").filter({ hasText: "Please correct the marked fields." }).waitFor();
    expect(await state.getByLabel("Root cause").getAttribute("aria-invalid")).toBe("true");
    expect((await excursions())[0]!.status).toBe("acknowledged");
    await state.getByLabel("Root cause").fill("Implanter dose drift");
    await state.getByLabel("Resolution note").fill("Recalibrated the implanter");
    await state.getByRole("button", { name: "Resolve the excursion" }).click();
    await state.getByText("Implanter dose drift").waitFor();
    await state.getByText("Recalibrated the implanter").waitFor();
    await page.getByText("resolved", { exact: true }).first().waitFor();
    const timeline = panel("Audit timeline");
    await timeline.getByText("acknowledged", { exact: true }).waitFor();
    await timeline.getByText("resolved", { exact: true }).waitFor();
    expect((await excursions())[0]!.status).toBe("resolved");
  });

  it("releases the lot once the excursion is resolved and e-mails the customer the lot report's link", async () => {
    await page.goto(`${appUrl}/lots/SHIFT-2`);
    const disposition = panel("Disposition");
    await disposition.getByText("on hold", { exact: true }).waitFor();
    expect(await disposition.getByText("Open excursions on this lot").count()).toBe(0);
    await disposition.getByLabel("Disposition", { exact: true }).selectOption("release");
    expect(await disposition.getByLabel("Override reason (open excursion)").count()).toBe(0);
    await disposition.getByLabel("Reason", { exact: true }).fill("excursion resolved, within spec");
    await disposition.getByRole("button", { name: "Release to the customer" }).click();
    await disposition.getByRole("status").filter({ hasText: /Lot is now released; 1 customer user\(s\) notified/ }).waitFor();
    expect(await lotStatus("SHIFT-2")).toBe("released");

    const mail = await waitForMessage(tenant.users.customer!.email, "Lot SHIFT-2 released", 30_000);
    expect(new URL(firstLink(mail, "/lots/")).pathname).toBe("/lots/SHIFT-2/report");
    await expect(waitForMessage(tenant.users.customer2!.email, "Lot SHIFT-2 released", 1_000)).rejects.toThrow(/no message/);
  });
});
