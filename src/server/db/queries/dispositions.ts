import "server-only";
import { type Kysely, sql } from "kysely";
import { DISPOSITION_STATUS, type Disposition, type DispositionRecord, type InkRequest } from "@/lib/schemas/dispositions";
import { AppError } from "../../http/errors";
import { enqueueEmail } from "../../mail/outbox";
import { linkMessage } from "../../mail/templates";
import type { Scope } from "../scope";
import type { Database, LotStatus } from "../schema";
import { recordAudit } from "./audit";
import { openExcursionsForLot } from "./excursions";

// Which statuses each action may start from. A released lot goes back on hold before it is scrapped.
const ALLOWED_FROM: Record<Disposition["action"], LotStatus[]> = {
  hold: ["receiving", "probed", "released"],
  release: ["probed", "on hold"],
  scrap: ["receiving", "probed", "on hold"],
};

export interface DispositionResult {
  lot: string;
  status: LotStatus;
  previousStatus: LotStatus;
  action: Disposition["action"];
  reason: string;
  overrideReason: string | null;
  by: string;
  at: string;
  releasedAt: string | null;
  /** Customer users e-mailed (release only). */
  notified: number;
}

/**
 * Hold, release or scrap a lot (§6): reason required, audited. A lot linked to an open or acknowledged excursion
 * is released only with an explicit override reason. Releasing queues the customer's e-mail in the same transaction.
 */
export async function setDisposition(tx: Kysely<Database>, scope: Scope, lotNumber: string, input: Disposition): Promise<DispositionResult> {
  const lot = await tx.selectFrom("lots").select(["id", "lot_number", "status", "customer_id", "product_id"]).where("lot_number", "=", lotNumber).forUpdate().executeTakeFirst();
  if (!lot) throw new AppError("not_found", `Lot ${lotNumber} not found`);
  if (!ALLOWED_FROM[input.action].includes(lot.status)) {
    throw new AppError("conflict", `Lot ${lotNumber} is ${lot.status}: it cannot be ${DISPOSITION_STATUS[input.action]} from there`);
  }
  const open = input.action === "release" ? await openExcursionsForLot(tx, lot.id) : [];
  if (open.length > 0 && !input.overrideReason) {
    throw new AppError("conflict", `Lot ${lotNumber} has ${open.length} open excursion(s) (${open.map((e) => e.number).join(", ")}): give an override reason to release it`, {
      openExcursions: open.map((e) => e.number),
      field: "overrideReason",
    });
  }
  const to = DISPOSITION_STATUS[input.action];
  const now = new Date();
  const updated = await tx
    .updateTable("lots")
    .set({ status: to, status_changed_at: now, updated_at: now, ...(input.action === "release" ? { released_at: now } : {}) })
    .where("id", "=", lot.id)
    .returning(["status", "released_at"])
    .executeTakeFirstOrThrow();
  const overrideReason = open.length > 0 ? (input.overrideReason ?? null) : null;
  await tx
    .insertInto("lot_dispositions")
    .values({ tenant_id: scope.tenantId, lot_id: lot.id, action: input.action, from_status: lot.status, to_status: to, reason: input.reason, override_reason: overrideReason, actor_user_id: scope.userId, actor_label: scope.actorLabel })
    .execute();
  await recordAudit(tx, scope, `lot.${input.action}`, { type: "lot", id: lot.lot_number }, {
    from: lot.status, to, reason: input.reason, overrideReason, openExcursions: open.map((e) => e.number),
  });
  const notified = input.action === "release" ? await queueReleaseMail(tx, scope, lot) : 0;
  return {
    lot: lot.lot_number, status: updated.status, previousStatus: lot.status, action: input.action, reason: input.reason, overrideReason,
    by: scope.actorLabel, at: now.toISOString(), releasedAt: updated.released_at?.toISOString() ?? null, notified,
  };
}

/** The customer's users (customer role, bound to the lot's customer) hear of the release with a link to the report. */
async function queueReleaseMail(tx: Kysely<Database>, scope: Scope, lot: { lot_number: string; customer_id: string | null; product_id: string }): Promise<number> {
  if (!lot.customer_id) return 0;
  const users = await tx
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["u.email"])
    .where("m.tenant_id", "=", scope.tenantId)
    .where("m.role", "=", "customer")
    .where("m.customer_id", "=", lot.customer_id)
    .execute();
  if (users.length === 0) return 0;
  const context = await tx
    .selectFrom("tenants")
    .select("name")
    .where("id", "=", scope.tenantId)
    .executeTakeFirstOrThrow();
  const product = await tx.selectFrom("products").select("code").where("id", "=", lot.product_id).executeTakeFirstOrThrow();
  const message = linkMessage(
    [`${context.name} released lot ${lot.lot_number} (${product.code}).`, "The lot report with its yields and wafer maps is ready for you."],
    { label: "Open the lot report", path: `/lots/${encodeURIComponent(lot.lot_number)}/report` },
  );
  await enqueueEmail(tx, users.map((u) => ({ tenantId: scope.tenantId, kind: "lot_released", to: u.email, subject: `Lot ${lot.lot_number} released`, ...message })));
  return users.length;
}

export async function listDispositions(tx: Kysely<Database>, lotId: string): Promise<DispositionRecord[]> {
  const rows = await tx.selectFrom("lot_dispositions").selectAll().where("lot_id", "=", lotId).orderBy("at", "desc").execute();
  return rows.map((r) => ({ action: r.action, fromStatus: r.from_status, toStatus: r.to_status, reason: r.reason, overrideReason: r.override_reason, actor: r.actor_label, at: r.at.toISOString() }));
}

/**
 * Inks (or un-inks) dies of one wafer: inked dies count as fails in the shipped yield (§6). Refused on a released
 * or scrapped lot; the wafer's inked count is recomputed; audited with the die list.
 */
export async function inkDies(tx: Kysely<Database>, scope: Scope, lotNumber: string, input: InkRequest): Promise<{ wafer: number; changed: number; inked: number }> {
  const lot = await tx.selectFrom("lots").select(["id", "status"]).where("lot_number", "=", lotNumber).forUpdate().executeTakeFirst();
  if (!lot) throw new AppError("not_found", `Lot ${lotNumber} not found`);
  if (lot.status === "released" || lot.status === "scrapped") throw new AppError("conflict", `Lot ${lotNumber} is ${lot.status}: put it on hold before inking`);
  const wafer = await tx.selectFrom("wafers").select("slot").where("lot_id", "=", lot.id).where("slot", "=", input.wafer).executeTakeFirst();
  if (!wafer) throw new AppError("not_found", `Wafer ${input.wafer} of lot ${lotNumber} not found`);
  const xs = input.dies.map(([x]) => x);
  const ys = input.dies.map(([, y]) => y);
  const changed = await sql<{ n: string }>`
    with target as (select * from unnest(${xs}::int[], ${ys}::int[]) as t(x, y)),
         done as (update dies d set inked = ${input.inked} from target t
                   where d.lot_id = ${lot.id} and d.wafer_slot = ${input.wafer} and d.x = t.x and d.y = t.y and d.inked <> ${input.inked} returning 1)
    select count(*) as n from done`.execute(tx);
  const count = await tx.selectFrom("dies").select((eb) => eb.fn.countAll<string>().as("n")).where("lot_id", "=", lot.id).where("wafer_slot", "=", input.wafer).where("inked", "=", true).executeTakeFirstOrThrow();
  const inked = Number(count.n);
  await tx.updateTable("wafers").set({ inked }).where("lot_id", "=", lot.id).where("slot", "=", input.wafer).execute();
  const n = Number(changed.rows[0]?.n ?? 0);
  await recordAudit(tx, scope, input.inked ? "dies.inked" : "dies.uninked", { type: "lot", id: lotNumber }, { wafer: input.wafer, dies: input.dies.slice(0, 1000), changed: n });
  return { wafer: input.wafer, changed: n, inked };
}
