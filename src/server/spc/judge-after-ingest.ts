import "server-only";
import { type Kysely, sql } from "kysely";
import { recordAudit } from "../db/queries/audit";
import { type Scope, systemScope, withScope } from "../db/scope";
import type { Database } from "../db/schema";
import { kickMailer } from "../mail/outbox";
import { getLotJudgement, type LotJudgement } from "./lot-judgement";
import { linkLot, openExcursion } from "./raise-excursion";
import { lotTriggers, type RaisedTrigger } from "./triggers";

export type RaiseOutcome = { trigger: RaisedTrigger["trigger"]; excursionNumber: number; outcome: "opened" | "linked" | "already linked" };

/**
 * One excursion per product and trigger while it is not resolved: a sustained shift adds its later lots to the
 * excursion its first lot opened instead of opening one per lot, and a lot already linked (a re-ingest) adds nothing.
 */
async function raise(tx: Kysely<Database>, scope: Scope, j: LotJudgement, t: RaisedTrigger): Promise<RaiseOutcome> {
  const lot = { lotId: j.lotId, lotNumber: j.lot, wafers: t.wafers, findings: t.findings };
  const linked = await tx
    .selectFrom("excursions as e")
    .innerJoin("excursion_lots as el", (jn) => jn.onRef("el.tenant_id", "=", "e.tenant_id").onRef("el.excursion_id", "=", "e.id"))
    .select("e.number")
    .where("e.product_id", "=", j.productId)
    .where("e.trigger", "=", t.trigger)
    .where("el.lot_id", "=", j.lotId)
    .executeTakeFirst();
  if (linked) return { trigger: t.trigger, excursionNumber: linked.number, outcome: "already linked" };
  const active = await tx
    .selectFrom("excursions")
    .select(["id", "number"])
    .where("product_id", "=", j.productId)
    .where("trigger", "=", t.trigger)
    .where("status", "in", ["open", "acknowledged"])
    .orderBy("opened_at", "desc")
    .limit(1)
    .executeTakeFirst();
  if (active) {
    await linkLot(tx, scope, active.id, lot);
    await recordAudit(tx, scope, "excursion.lot_linked", { type: "excursion", id: active.id }, { lot: j.lot, wafers: t.wafers, findings: t.findings.length });
    return { trigger: t.trigger, excursionNumber: active.number, outcome: "linked" };
  }
  const opened = await openExcursion(tx, scope, {
    productId: j.productId,
    productCode: j.product,
    trigger: t.trigger,
    title: t.title,
    limitSetId: t.trigger === "rule" ? (j.limitSet?.id ?? null) : null,
    evidence: { lot: j.lot, probedAt: j.probedAt, limitVersion: j.limitSet?.version ?? null, rules: j.rules, findings: t.findings },
    lots: [lot],
  });
  return { trigger: t.trigger, excursionNumber: opened.number, outcome: "opened" };
}

/**
 * Judges a lot and opens or extends excursions, in one transaction of its own; the mail goes after the commit.
 * With a job id, the outcome is added to that job's report as `spc`, so a client sees when judging is over.
 */
export async function judgeLotAndRaise(tenantId: string, lotId: string, jobId: string | null = null, actorLabel = "SPC judging"): Promise<RaiseOutcome[]> {
  const scope = systemScope(tenantId, actorLabel);
  const outcomes = await withScope(scope, async (tx) => {
    const j = await getLotJudgement(tx, lotId);
    // Judgements of one product queue behind each other, so two lots cannot both open "the" excursion.
    await sql`select pg_advisory_xact_lock(hashtextextended('judge:' || ${j.productId}, 0))`.execute(tx);
    const results: RaiseOutcome[] = [];
    for (const t of lotTriggers(j)) results.push(await raise(tx, scope, j, t));
    if (jobId) {
      const spc = { limitVersion: j.limitSet?.version ?? null, ruleHits: j.hits.length, excursions: results };
      await sql`update ingest_jobs set report = coalesce(report, '{}'::jsonb) || jsonb_build_object('spc', ${JSON.stringify(spc)}::jsonb) where id = ${jobId}`.execute(tx);
    }
    return results;
  });
  if (outcomes.some((o) => o.outcome === "opened")) kickMailer();
  return outcomes;
}

/** The ingest job's hook, after its commit: a judging failure is logged and never loses the ingest. */
export async function judgeAfterIngest(tenantId: string, lotId: string, jobId: string): Promise<void> {
  try {
    await judgeLotAndRaise(tenantId, lotId, jobId);
  } catch (error) {
    console.error(`SPC judging of lot ${lotId} failed:`, error);
  }
}
