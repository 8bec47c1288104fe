import "server-only";
import { type Kysely, sql } from "kysely";
import { TRIGGER_LABELS, type ExcursionFinding, type ExcursionTrigger } from "@/lib/schemas/excursions";
import { recordAudit } from "../db/queries/audit";
import { excursionRecipients } from "../db/queries/watchers";
import type { Scope } from "../db/scope";
import type { Database } from "../db/schema";
import { enqueueEmail } from "../mail/outbox";
import { linkMessage } from "../mail/templates";

export interface NewExcursion {
  productId: string;
  productCode: string;
  trigger: ExcursionTrigger;
  title: string;
  limitSetId: string | null;
  evidence: Record<string, unknown>;
  lots: { lotId: string; lotNumber: string; wafers: number[]; findings: ExcursionFinding[] }[];
}

/** Opens an excursion with its lots, audited, and queues the watch list's e-mail in the same transaction. */
export async function openExcursion(tx: Kysely<Database>, scope: Scope, input: NewExcursion): Promise<{ id: string; number: number }> {
  // Numbers are per tenant: serialise the few transactions that open one.
  await sql`select pg_advisory_xact_lock(hashtextextended('excursions:' || ${scope.tenantId}, 0))`.execute(tx);
  const last = await tx.selectFrom("excursions").select((eb) => eb.fn.max("number").as("n")).executeTakeFirst();
  const number = Number(last?.n ?? 0) + 1;
  const row = await tx
    .insertInto("excursions")
    .values({
      tenant_id: scope.tenantId, number, product_id: input.productId, trigger: input.trigger, title: input.title, limit_set_id: input.limitSetId,
      evidence: JSON.stringify(input.evidence), opened_by_label: scope.actorLabel, owner_user_id: null,
    })
    .returning(["id", "number"])
    .executeTakeFirstOrThrow();
  for (const lot of input.lots) await linkLot(tx, scope, row.id, lot);
  await recordAudit(tx, scope, "excursion.opened", { type: "excursion", id: row.id }, { number, trigger: input.trigger, title: input.title, lots: input.lots.map((l) => l.lotNumber) });
  const recipients = await excursionRecipients(tx, input.productId);
  const lots = input.lots.map((l) => l.lotNumber).join(", ") || "none yet";
  const message = linkMessage(
    [
      `Excursion ${number} was opened on ${input.productCode} (${TRIGGER_LABELS[input.trigger].toLowerCase()}).`,
      input.title,
      `Lots: ${lots}.`,
      "SPC signals support your quality system and never replace its disposition procedures.",
    ],
    { label: "Open the excursion", path: `/excursions/${number}` },
  );
  await enqueueEmail(tx, recipients.map((r) => ({ tenantId: scope.tenantId, kind: "excursion_opened", to: r.email, subject: `Excursion ${number}: ${input.title}`, ...message })));
  return row;
}

/** Adds a lot to an excursion (idempotent: a lot already linked keeps its first findings). */
export async function linkLot(tx: Kysely<Database>, scope: Scope, excursionId: string, lot: NewExcursion["lots"][number]): Promise<boolean> {
  const inserted = await tx
    .insertInto("excursion_lots")
    .values({ tenant_id: scope.tenantId, excursion_id: excursionId, lot_id: lot.lotId, wafers: lot.wafers, findings: JSON.stringify(lot.findings) })
    .onConflict((oc) => oc.doNothing())
    .returning("lot_id")
    .executeTakeFirst();
  if (inserted) await tx.updateTable("excursions").set({ updated_at: new Date() }).where("id", "=", excursionId).execute();
  return Boolean(inserted);
}
