import "server-only";
import { type Kysely, sql } from "kysely";
import type { ExcursionDetail, ExcursionFilters, ExcursionFinding, ExcursionListItem, ExcursionStatus, ExcursionTransition } from "@/lib/schemas/excursions";
import { AppError } from "../../http/errors";
import type { Scope } from "../scope";
import type { Database } from "../schema";
import { recordAudit } from "./audit";

const ACTIVE: ExcursionStatus[] = ["open", "acknowledged"];

function listQuery(tx: Kysely<Database>) {
  return tx
    .selectFrom("excursions as e")
    .innerJoin("products as p", (j) => j.onRef("p.tenant_id", "=", "e.tenant_id").onRef("p.id", "=", "e.product_id"))
    .leftJoin("users as u", "u.id", "e.owner_user_id")
    .select([
      "e.id", "e.number", "e.status", "e.trigger", "e.title", "e.opened_at", "e.updated_at", "e.owner_user_id", "e.opened_by_label", "e.acknowledged_at",
      "e.resolved_at", "e.root_cause", "e.resolution_note", "e.evidence", "e.limit_set_id", "p.code as product", "u.name as owner",
    ])
    .select(sql<string[]>`coalesce((select array_agg(l.lot_number order by el.added_at, l.lot_number) from excursion_lots el join lots l on l.tenant_id = el.tenant_id and l.id = el.lot_id where el.tenant_id = e.tenant_id and el.excursion_id = e.id), '{}')`.as("lots"));
}

type Row = Awaited<ReturnType<ReturnType<typeof listQuery>["executeTakeFirstOrThrow"]>>;

function toItem(r: Row): ExcursionListItem {
  return {
    id: r.id, number: r.number, status: r.status, product: r.product, trigger: r.trigger, title: r.title, lots: r.lots, owner: r.owner,
    openedAt: r.opened_at.toISOString(), updatedAt: r.updated_at.toISOString(),
  };
}

/** Excursions of the tenant, newest first, filtered by status and product code. */
export async function listExcursions(tx: Kysely<Database>, filters: ExcursionFilters): Promise<ExcursionListItem[]> {
  let q = listQuery(tx);
  if (filters.status) q = q.where("e.status", "=", filters.status);
  if (filters.product) q = q.where("p.code", "=", filters.product);
  return (await q.orderBy("e.opened_at", "desc").orderBy("e.number", "desc").limit(1000).execute()).map(toItem);
}

/** Finds an excursion by its number ("7") or its id; 404 otherwise. */
export async function findExcursionRow(tx: Kysely<Database>, ref: string): Promise<Row> {
  const isNumber = /^\d{1,9}$/.test(ref);
  const isUuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(ref);
  if (!isNumber && !isUuid) throw new AppError("not_found", "Excursion not found");
  const row = await listQuery(tx).where(isNumber ? "e.number" : "e.id", "=", isNumber ? Number(ref) : ref).executeTakeFirst();
  if (!row) throw new AppError("not_found", "Excursion not found");
  return row;
}

export async function getExcursion(tx: Kysely<Database>, ref: string): Promise<ExcursionDetail> {
  const r = await findExcursionRow(tx, ref);
  const linked = await tx
    .selectFrom("excursion_lots as el")
    .innerJoin("lots as l", (j) => j.onRef("l.tenant_id", "=", "el.tenant_id").onRef("l.id", "=", "el.lot_id"))
    .select(["l.lot_number", "l.status", "el.wafers", "el.findings", "el.added_at"])
    .where("el.excursion_id", "=", r.id)
    .orderBy("el.added_at")
    .execute();
  const comments = await tx.selectFrom("excursion_comments").select(["id", "author_label", "body", "created_at"]).where("excursion_id", "=", r.id).orderBy("created_at").execute();
  const version = r.limit_set_id ? await tx.selectFrom("limit_sets").select("version").where("id", "=", r.limit_set_id).executeTakeFirst() : undefined;
  return {
    ...toItem(r),
    ownerUserId: r.owner_user_id,
    openedBy: r.opened_by_label,
    acknowledgedAt: r.acknowledged_at?.toISOString() ?? null,
    resolvedAt: r.resolved_at?.toISOString() ?? null,
    rootCause: r.root_cause,
    resolutionNote: r.resolution_note,
    limitVersion: version?.version ?? null,
    evidence: (r.evidence ?? {}) as Record<string, unknown>,
    linkedLots: linked.map((l) => ({ lot: l.lot_number, status: l.status, wafers: l.wafers, findings: l.findings as ExcursionFinding[], addedAt: l.added_at.toISOString() })),
    comments: comments.map((c) => ({ id: c.id, author: c.author_label, body: c.body, at: c.created_at.toISOString() })),
  };
}

/** Open or acknowledged excursions linking the lot, for the lot summary (§9). */
export async function openExcursionsForLot(tx: Kysely<Database>, lotId: string): Promise<{ id: string; number: number; title: string; status: ExcursionStatus; openedAt: string }[]> {
  const rows = await tx
    .selectFrom("excursions as e")
    .innerJoin("excursion_lots as el", (j) => j.onRef("el.tenant_id", "=", "e.tenant_id").onRef("el.excursion_id", "=", "e.id"))
    .select(["e.id", "e.number", "e.title", "e.status", "e.opened_at"])
    .where("el.lot_id", "=", lotId)
    .where("e.status", "in", ACTIVE)
    .orderBy("e.opened_at")
    .execute();
  return rows.map((r) => ({ id: r.id, number: r.number, title: r.title, status: r.status, openedAt: r.opened_at.toISOString() }));
}

/** open → acknowledged → resolved (root cause and note required); anything else is a 409. Audited. */
export async function transitionExcursion(tx: Kysely<Database>, scope: Scope, input: ExcursionTransition): Promise<void> {
  const row = await tx.selectFrom("excursions").select(["id", "status", "owner_user_id"]).where("id", "=", input.id).forUpdate().executeTakeFirst();
  if (!row) throw new AppError("not_found", "Excursion not found");
  const now = new Date();
  if (input.to === "acknowledged") {
    if (row.status !== "open") throw new AppError("conflict", `The excursion is ${row.status}, not open`);
    await tx.updateTable("excursions").set({ status: "acknowledged", acknowledged_at: now, updated_at: now, owner_user_id: row.owner_user_id ?? scope.userId }).where("id", "=", row.id).execute();
  } else {
    if (row.status === "resolved") throw new AppError("conflict", "The excursion is already resolved");
    await tx.updateTable("excursions").set({ status: "resolved", resolved_at: now, updated_at: now, root_cause: input.rootCause, resolution_note: input.note }).where("id", "=", row.id).execute();
  }
  const details = input.to === "resolved" ? { from: row.status, to: input.to, rootCause: input.rootCause, note: input.note } : { from: row.status, to: input.to };
  await recordAudit(tx, scope, `excursion.${input.to}`, { type: "excursion", id: row.id }, details);
}

export async function addExcursionComment(tx: Kysely<Database>, scope: Scope, id: string, body: string): Promise<void> {
  const row = await tx.selectFrom("excursions").select("id").where("id", "=", id).executeTakeFirst();
  if (!row) throw new AppError("not_found", "Excursion not found");
  await tx.insertInto("excursion_comments").values({ tenant_id: scope.tenantId, excursion_id: id, author_user_id: scope.userId, author_label: scope.actorLabel, body }).execute();
  await tx.updateTable("excursions").set({ updated_at: new Date() }).where("id", "=", id).execute();
  await recordAudit(tx, scope, "excursion.commented", { type: "excursion", id }, { length: body.length });
}

/** Sets (or clears) the owner: an engineer or admin of this tenant. */
export async function setExcursionOwner(tx: Kysely<Database>, scope: Scope, id: string, ownerUserId: string | null): Promise<void> {
  const row = await tx.selectFrom("excursions").select("id").where("id", "=", id).executeTakeFirst();
  if (!row) throw new AppError("not_found", "Excursion not found");
  if (ownerUserId) {
    const member = await tx.selectFrom("memberships").select("role").where("tenant_id", "=", scope.tenantId).where("user_id", "=", ownerUserId).executeTakeFirst();
    if (!member || (member.role !== "engineer" && member.role !== "admin")) throw new AppError("unprocessable", "The owner must be an engineer or admin of this tenant");
  }
  await tx.updateTable("excursions").set({ owner_user_id: ownerUserId, updated_at: new Date() }).where("id", "=", id).execute();
  await recordAudit(tx, scope, "excursion.owner_set", { type: "excursion", id }, { ownerUserId });
}

/** Engineers and admins who can own an excursion. */
export async function listPossibleOwners(tx: Kysely<Database>, scope: Scope): Promise<{ userId: string; name: string }[]> {
  const rows = await tx
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["u.id", "u.name"])
    .where("m.tenant_id", "=", scope.tenantId)
    .where("m.role", "in", ["engineer", "admin"])
    .orderBy("u.name")
    .execute();
  return rows.map((r) => ({ userId: r.id, name: r.name }));
}
