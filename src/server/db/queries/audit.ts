import "server-only";
import type { Kysely } from "kysely";
import type { Scope } from "../scope";
import type { Database } from "../schema";

/** Appends an audit event in the caller's transaction, so the event and its record commit together. */
export async function recordAudit(
  tx: Kysely<Database>,
  scope: Scope,
  action: string,
  subject: { type: string; id: string },
  details: Record<string, unknown> = {},
): Promise<void> {
  await tx
    .insertInto("audit_events")
    .values({
      tenant_id: scope.tenantId,
      actor_user_id: scope.userId,
      actor_label: scope.actorLabel,
      action,
      subject_type: subject.type,
      subject_id: subject.id,
      details: JSON.stringify(details),
    })
    .execute();
}

export interface AuditEntry {
  at: string;
  actor: string;
  action: string;
  subjectType: string;
  subjectId: string;
  details: Record<string, unknown>;
}

export async function listAudit(tx: Kysely<Database>, filter: { subjectType?: string; subjectId?: string; limit?: number }): Promise<AuditEntry[]> {
  let q = tx.selectFrom("audit_events").select(["at", "actor_label", "action", "subject_type", "subject_id", "details"]).orderBy("at", "desc").orderBy("id", "desc");
  if (filter.subjectType) q = q.where("subject_type", "=", filter.subjectType);
  if (filter.subjectId) q = q.where("subject_id", "=", filter.subjectId);
  const rows = await q.limit(filter.limit ?? 200).execute();
  return rows.map((r) => ({
    at: r.at.toISOString(),
    actor: r.actor_label,
    action: r.action,
    subjectType: r.subject_type,
    subjectId: r.subject_id,
    details: (r.details ?? {}) as Record<string, unknown>,
  }));
}
