import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { limitSetFromBaseline } from "@/domain/spc";
import { profile, projectRoot } from "@/cli/profile";
import { readPid, startDetached, waitForPort } from "@/cli/processes";
import { api, ingestAndWait } from "@/test/ingest-helpers";
import { ninesAround, probeFile } from "@/test/spc-files";
import { createTestTenant, ownerPool, type TestTenant } from "@/test/tenants";
import { excursionTransitionSchema } from "@/lib/schemas/excursions";
import { listAudit } from "../db/queries/audit";
import { listDispositions } from "../db/queries/dispositions";
import { addExcursionComment, getExcursion, transitionExcursion } from "../db/queries/excursions";
import { raiseExcursionByHand } from "./manual-excursion";
import { type Scope, withScope } from "../db/scope";

// Issue 6 end to end through the API and the worker: 20 stable lots, freeze, then a sustained shift of +1.5σ̂ in
// wafer median G. With 3 wafers a lot, Western Electric rule 3 (4 of 5 beyond 1σ) first completes on the first
// wafer of the second shifted lot, and the lot X̄ (shift ≈ 2.7 σ of a mean) completes rule 2 (2 of 3 beyond 2σ) there too.
const pool = ownerPool();
const PRODUCT = "SPC-SHIFT";
const G0 = 1.5e-6;
const A = 0.02;
const PATTERN = [1, 0, -1]; // every baseline lot: wafers at G0·(1 + A·z), so each lot's mean is G0
const mailUrl = process.env.MAIL_FAKE_URL!;
let tenant: TestTenant;
let sigmaS = 0;

interface Message { to: string[]; subject: string; text: string }
async function messagesTo(address: string): Promise<Message[]> {
  const { messages } = (await (await fetch(`${mailUrl}/messages`)).json()) as { messages: Message[] };
  return messages.filter((m) => m.to.includes(address));
}
async function waitForMessages(address: string, subject: string, count: number, timeoutMs = 20_000): Promise<Message[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await messagesTo(address)).filter((m) => m.subject.includes(subject));
    if (found.length >= count || Date.now() > deadline) return found;
    await new Promise((r) => setTimeout(r, 250));
  }
}
async function asTenant(sqlText: string, params: unknown[]): Promise<void> {
  const client = await pool.connect();
  try {
    await client.query("begin");
    await client.query("select set_config('app.tenant_id', $1, true)", [tenant.id]);
    await client.query(sqlText, params);
    await client.query("commit");
  } finally {
    client.release();
  }
}
/** Ingests and waits until the SPC judging after the commit has written its outcome into the job report. */
async function ingestJudged(body: string): Promise<{ excursions: { outcome: string }[] }> {
  const job = await ingestAndWait(tenant, body);
  expect(job.status).toBe("done");
  const deadline = Date.now() + 20_000;
  for (;;) {
    const { report } = await (await api(tenant, "analyst", `/api/v1/jobs/${job.id}`)).json();
    if (report?.spc) return report.spc;
    if (Date.now() > deadline) throw new Error(`job ${job.id} was never judged`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
const staff = (): Scope => ({ tenantId: tenant.id, userId: tenant.users.engineer!.id, role: "engineer", customerId: null, actorLabel: "engineer" });
const json = (body: unknown): RequestInit => ({ method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
const excursions = async () => (await (await api(tenant, "analyst", `/api/v1/excursions?product=${PRODUCT}`)).json()).excursions as { id: string; number: number; lots: string[]; trigger: string; status: string }[];
const shiftedLot = (n: number, extra: Record<string, string> = {}) =>
  probeFile(`SHIFT-${n}`, PRODUCT, [1, 2, 3].map((slot) => {
    const dies = ninesAround(G0 + 1.5 * sigmaS);
    // One far-out die on the first shifted lot: the static die window must flag it (it replaces the top die, so the median stays).
    if (n === 1 && slot === 1) dies[8] = 1.3 * G0;
    return { slot, diesS: dies };
  }), extra);

beforeAll(async () => {
  tenant = await createTestTenant(pool, "spc");
  const created = await api(tenant, "engineer", "/api/v1/products", json({
    code: PRODUCT, name: "Shift check", customerId: tenant.customers[0]!.id, dieWidthMm: 5, dieHeightMm: 5, waferDiameterMm: 150,
    specLowS: 0.5e-6, specHighS: 3e-6, yieldFloor: 0.5, rules: "western-electric", dieWindow: "static",
  }));
  expect(created.status).toBe(201);
  const product = await pool.query("select id from products where tenant_id = $1 and code = $2", [tenant.id, PRODUCT]);
  await asTenant("insert into product_watchers (tenant_id, product_id, user_id) values ($1, $2, $3)", [tenant.id, product.rows[0].id, tenant.users.engineer!.id]);
  for (let lot = 1; lot <= 20; lot++) {
    const wafers = PATTERN.map((z, i) => ({ slot: i + 1, diesS: ninesAround(G0 * (1 + A * z)) }));
    const job = await ingestAndWait(tenant, probeFile(`BASE-${String(lot).padStart(2, "0")}`, PRODUCT, wafers));
    expect(job.status).toBe("done");
  }
}, 120_000);
afterAll(() => pool.end());

describe("SPC loop: freeze, judge, excursion, e-mail, disposition (issue 6)", () => {
  it("freezes version 1 from the 20 baseline lots with the individuals limits the domain computes", async () => {
    const lots = Array.from({ length: 20 }, (_, i) => `BASE-${String(i + 1).padStart(2, "0")}`);
    const preview = await api(tenant, "engineer", `/api/v1/products/${PRODUCT}/limits`, json({ lots, preview: true }));
    expect(preview.status).toBe(200);
    const review = await preview.json();
    expect(review.histogram.counts.reduce((a: number, b: number) => a + b, 0)).toBe(20 * 3 * 9);
    expect(review.normality.n).toBe(60);
    expect((await api(tenant, "analyst", `/api/v1/products/${PRODUCT}/limits`)).status).toBe(200);
    expect((await (await api(tenant, "analyst", `/api/v1/products/${PRODUCT}/limits`)).json()).versions).toEqual([]);

    const frozen = await api(tenant, "engineer", `/api/v1/products/${PRODUCT}/limits`, json({ lots, note: "first baseline" }));
    expect(frozen.status).toBe(201);
    const body = await frozen.json();
    const expected = limitSetFromBaseline(lots.map(() => PATTERN.map((z) => ({ medianConductanceS: G0 * (1 + A * z), yieldFraction: 1 }))));
    const individuals = body.limits.waferMedianConductanceS.individuals;
    // Fitted G from 12-digit currents: a relative 1e-6 covers the print rounding.
    expect(individuals.center).toBeCloseTo(expected.waferMedianConductanceS.individuals.center, 12);
    expect(Math.abs(individuals.sigma / expected.waferMedianConductanceS.individuals.sigma - 1)).toBeLessThan(1e-4);
    expect(body).toMatchObject({ version: 1, lotCount: 20, waferCount: 60, dieCount: 540 });
    expect(body.dieWindow.lowS).toBeLessThan(G0);
    sigmaS = individuals.sigma;
    const versions = (await (await api(tenant, "analyst", `/api/v1/products/${PRODUCT}/limits`)).json()).versions;
    expect(versions.map((v: { version: number; frozenBy: string }) => v.version)).toEqual([1]);
  });

  it("flags the far-out die against the frozen static window and opens nothing for the first shifted lot", async () => {
    expect((await ingestJudged(shiftedLot(1))).excursions).toEqual([]);
    const { dies } = await (await api(tenant, "analyst", "/api/v1/lots/SHIFT-1/dies?outOfWindow=true")).json();
    expect(dies.map((d: { wafer: number; x: number; y: number }) => [d.wafer, d.x, d.y])).toEqual([[1, 2, 2]]);
    expect(await excursions()).toEqual([]);
  });

  it("opens one rule excursion at the second shifted lot (WE3 on the wafers, WE2 on the lot mean) and e-mails the watch list once", async () => {
    expect((await ingestJudged(shiftedLot(2))).excursions.map((e) => e.outcome)).toEqual(["opened"]);
    const list = await excursions();
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ trigger: "rule", status: "open", lots: ["SHIFT-2"] });
    const detail = await withScope(staff(), (tx) => getExcursion(tx, String(list[0]!.number)));
    const findings = detail.linkedLots[0]!.findings;
    expect(findings.filter((f) => f.chart.startsWith("Individuals")).map((f) => [f.rule, f.wafer])).toEqual([["WE3", 1], ["WE3", 2], ["WE3", 3]]);
    expect(findings.filter((f) => f.chart.startsWith("Lot X̄")).map((f) => f.rule)).toEqual(["WE2"]);
    expect(detail.limitVersion).toBe(1);
    const lot = await (await api(tenant, "analyst", "/api/v1/lots/SHIFT-2")).json();
    expect(lot.openExcursions.map((e: { id: string }) => e.id)).toEqual([list[0]!.id]);
    expect((await (await api(tenant, "customer", "/api/v1/lots/SHIFT-2")).json()).error.code).toBe("not_found");

    const mail = await waitForMessages(tenant.users.engineer!.email, `Excursion ${list[0]!.number}`, 1);
    expect(mail).toHaveLength(1);
    expect(mail[0]!.text).toContain(`/excursions/${list[0]!.number}`);
    expect(await messagesTo(tenant.users.admin!.email)).toEqual([]); // the watch list is not empty, so only its engineer
  });

  it("adds the next shifted lot to the same excursion, and a re-ingest of a lot duplicates nothing", async () => {
    expect((await ingestJudged(shiftedLot(3))).excursions.map((e) => e.outcome)).toEqual(["linked"]);
    expect((await ingestJudged(shiftedLot(2, { rerun: "2" }))).excursions.map((e) => e.outcome)).toEqual(["already linked"]);
    const list = await excursions();
    expect(list).toHaveLength(1);
    expect(list[0]!.lots).toEqual(["SHIFT-2", "SHIFT-3"]);
    await new Promise((r) => setTimeout(r, 1500));
    expect(await messagesTo(tenant.users.engineer!.email)).toHaveLength(1);
  });

  it("holds a lot, refuses its release while the excursion is open, releases it with an override and mails the customer", async () => {
    const hold = await api(tenant, "engineer", "/api/v1/lots/SHIFT-2/disposition", json({ action: "hold", reason: "shifted G under review" }));
    expect(await hold.json()).toMatchObject({ status: "on hold", releasedAt: null });
    const refused = await api(tenant, "engineer", "/api/v1/lots/SHIFT-2/disposition", json({ action: "release", reason: "looks fine" }));
    expect(refused.status).toBe(409);
    expect((await api(tenant, "engineer", "/api/v1/lots/SHIFT-2/disposition", json({ action: "release" }))).status).toBe(422);
    const released = await api(tenant, "engineer", "/api/v1/lots/SHIFT-2/disposition", json({ action: "release", reason: "within spec", overrideReason: "customer accepts the shift in writing" }));
    expect(released.status).toBe(200);
    const body = await released.json();
    expect(body.status).toBe("released");
    expect(Date.parse(body.releasedAt)).toBeGreaterThan(Date.now() - 60_000);
    const [mail] = await waitForMessages(tenant.users.customer!.email, "Lot SHIFT-2 released", 1);
    expect(mail!.text).toContain("/lots/SHIFT-2/report");
    expect(await messagesTo(tenant.users.customer2!.email)).toEqual([]);
    const history = await withScope(staff(), async (tx) => listDispositions(tx, (await tx.selectFrom("lots").select("id").where("lot_number", "=", "SHIFT-2").executeTakeFirstOrThrow()).id));
    expect(history.map((d) => d.action)).toEqual(["release", "hold"]);
    expect(history[0]!.overrideReason).toBe("customer accepts the shift in writing");
    expect((await api(tenant, "engineer", "/api/v1/lots/SHIFT-2/disposition", json({ action: "scrap", reason: "not needed" }))).status).toBe(409);
  });

  it("inks dies, keeps the wafer's count, and refuses inking a released lot", async () => {
    const ink = await api(tenant, "engineer", "/api/v1/lots/SHIFT-1/ink", json({ wafer: 1, dies: [[2, 2], [0, 0]], inked: true }));
    expect(await ink.json()).toEqual({ wafer: 1, changed: 2, inked: 2 });
    const again = await api(tenant, "engineer", "/api/v1/lots/SHIFT-1/ink", json({ wafer: 1, dies: [[0, 0]], inked: false }));
    expect(await again.json()).toEqual({ wafer: 1, changed: 1, inked: 1 });
    const lot = await (await api(tenant, "analyst", "/api/v1/lots/SHIFT-1")).json();
    expect(lot.wafers[0].inked).toBe(1);
    expect((await api(tenant, "engineer", "/api/v1/lots/SHIFT-2/ink", json({ wafer: 1, dies: [[0, 0]], inked: true }))).status).toBe(409);
  });

  it("walks the excursion open → acknowledged → resolved, refusing a resolution without root cause, with an audit timeline", async () => {
    const scope = staff();
    const [first] = await excursions();
    expect(excursionTransitionSchema.safeParse({ id: first!.id, to: "resolved", rootCause: "", note: "x" }).success).toBe(false);
    await withScope(scope, (tx) => transitionExcursion(tx, scope, { id: first!.id, to: "acknowledged" }));
    await withScope(scope, (tx) => addExcursionComment(tx, scope, first!.id, "Implant dose log checked"));
    await expect(withScope(scope, (tx) => transitionExcursion(tx, scope, { id: first!.id, to: "acknowledged" }))).rejects.toThrow(/not open/);
    await withScope(scope, (tx) => transitionExcursion(tx, scope, { id: first!.id, to: "resolved", rootCause: "Implanter dose drift", note: "Recalibrated" }));
    const detail = await withScope(scope, (tx) => getExcursion(tx, String(first!.number)));
    expect(detail).toMatchObject({ status: "resolved", rootCause: "Implanter dose drift", ownerUserId: tenant.users.engineer!.id });
    expect(detail.comments.map((c) => c.body)).toEqual(["Implant dose log checked"]);
    const timeline = await withScope(scope, (tx) => listAudit(tx, { subjectType: "excursion", subjectId: first!.id }));
    expect(timeline.map((e) => e.action).reverse()).toEqual(["excursion.opened", "excursion.lot_linked", "excursion.acknowledged", "excursion.commented", "excursion.resolved"]);
    const customerScope: Scope = { ...scope, userId: tenant.users.customer!.id, role: "customer", customerId: tenant.customers[0]!.id };
    expect(await withScope(customerScope, (tx) => tx.selectFrom("excursions").select("id").execute())).toEqual([]);
    expect(await withScope(customerScope, (tx) => tx.selectFrom("limit_sets").select("id").execute())).toEqual([]);
  });

  it("delivers an excursion mail queued while the relay is down once the relay is back", async () => {
    const test = profile("test");
    const pid = readPid(test.dataDir, "smtp-fake");
    expect(pid).not.toBeNull();
    const relayUp = () => fetch(`${mailUrl}/health`).then(() => true, () => false);
    process.kill(pid!, "SIGTERM");
    let number = 0;
    try {
      for (let i = 0; i < 50 && (await relayUp()); i++) await new Promise((r) => setTimeout(r, 100));
      expect(await relayUp()).toBe(false);
      number = (await raiseExcursionByHand(staff(), { product: PRODUCT, title: "Probe card wear suspected", lots: ["SHIFT-3"], note: "seen on PRB-03" })).number;
      // The app tries at once (kickMailer) and the worker every second; with the relay gone the message must stay queued.
      await new Promise((r) => setTimeout(r, 1500));
      const { rows } = await pool.query("select status from outbound_emails where tenant_id = $1 and subject like $2", [tenant.id, `Excursion ${number}:%`]);
      expect(rows.map((r) => r.status)).toEqual(["pending"]);
    } finally {
      // Always bring the shared relay back, the way src/cli/services.ts starts it.
      startDetached(test.dataDir, "smtp-fake", process.execPath, ["--import", "tsx", path.join(projectRoot, "src/cli/smtp-fake.ts"), String(test.smtpPort), String(test.mailApiPort), path.join(test.dataDir, "mail")], process.env, projectRoot);
      await waitForPort(test.smtpPort, "smtp fake");
      await waitForPort(test.mailApiPort, "smtp fake mailbox API");
      // Skip the back-off (30 s after a failed attempt) for whatever failed during the outage, this test's mail included.
      await pool.query("update outbound_emails set next_attempt_at = now() where status = 'pending'");
    }
    const mail = await waitForMessages(tenant.users.engineer!.email, `Excursion ${number}:`, 1, 20_000);
    expect(mail).toHaveLength(1);
  });
});
