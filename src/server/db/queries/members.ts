import "server-only";
import type { Kysely } from "kysely";
import type { Role } from "@/lib/permissions";
import type { InvitationRow } from "@/lib/schemas/members";
import { AppError } from "../../http/errors";
import type { Scope } from "../scope";
import type { Database } from "../schema";
import { recordAudit } from "./audit";

async function assertAnotherAdminRemains(tx: Kysely<Database>, userId: string): Promise<void> {
  const admins = await tx.selectFrom("memberships").select("user_id").where("role", "=", "admin").execute();
  if (admins.length === 1 && admins[0]!.user_id === userId) throw new AppError("conflict", "A tenant needs at least one admin: make someone else admin first.");
}

export async function changeMemberRole(tx: Kysely<Database>, scope: Scope, userId: string, role: Role, customerId: string | null): Promise<void> {
  if ((role === "customer") !== Boolean(customerId)) throw new AppError("unprocessable", "A customer user needs a customer account, and only they do");
  const current = await tx.selectFrom("memberships").select(["role", "customer_id"]).where("user_id", "=", userId).executeTakeFirst();
  if (!current) throw new AppError("not_found", "Member not found");
  if (current.role === "admin" && role !== "admin") await assertAnotherAdminRemains(tx, userId);
  await tx.updateTable("memberships").set({ role, customer_id: customerId }).where("user_id", "=", userId).execute();
  await recordAudit(tx, scope, "member.role_changed", { type: "user", id: userId }, { from: current.role, to: role, customerId });
}

export async function removeMember(tx: Kysely<Database>, scope: Scope, userId: string): Promise<void> {
  const current = await tx.selectFrom("memberships").select("role").where("user_id", "=", userId).executeTakeFirst();
  if (!current) throw new AppError("not_found", "Member not found");
  if (current.role === "admin") await assertAnotherAdminRemains(tx, userId);
  await tx.deleteFrom("memberships").where("user_id", "=", userId).execute();
  await recordAudit(tx, scope, "member.removed", { type: "user", id: userId }, { role: current.role });
}

export async function listInvitations(tx: Kysely<Database>): Promise<InvitationRow[]> {
  const rows = await tx.selectFrom("invitations").select(["id", "email", "role", "created_at", "expires_at", "accepted_at", "revoked_at"]).orderBy("created_at", "desc").limit(200).execute();
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    role: r.role,
    createdAt: r.created_at.toISOString(),
    expiresAt: r.expires_at.toISOString(),
    state: r.accepted_at ? "accepted" : r.revoked_at ? "withdrawn" : r.expires_at.getTime() < Date.now() ? "expired" : "pending",
  }));
}

export async function withdrawInvitation(tx: Kysely<Database>, scope: Scope, id: string): Promise<void> {
  const row = await tx.updateTable("invitations").set({ revoked_at: new Date() }).where("id", "=", id).where("accepted_at", "is", null).returning("email").executeTakeFirst();
  if (!row) throw new AppError("not_found", "Invitation not found");
  await recordAudit(tx, scope, "invitation.withdrawn", { type: "invitation", id }, { email: row.email });
}
