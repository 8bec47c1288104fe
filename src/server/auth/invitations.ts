import "server-only";
import { sql } from "kysely";
import { ROLE_LABELS, type Role } from "@/lib/permissions";
import { recordAudit } from "../db/queries/audit";
import { type Scope, systemScope, withGlobal, withLookup, withScope } from "../db/scope";
import { AppError } from "../http/errors";
import { enqueueEmail, kickMailer } from "../mail/outbox";
import { linkMessage } from "../mail/templates";
import { hashPassword, newToken, sha256, verifyPassword } from "./secrets";
import { createSession, type CookieSpec } from "./session";

export const INVITATION_DAYS = 7;

export interface InvitationInput {
  email: string;
  role: Role;
  customerId: string | null;
}

/** Creates a single-use invitation (only its hash is stored) and queues its e-mail in the same transaction. */
export async function createInvitation(scope: Scope, input: InvitationInput): Promise<{ id: string; expiresAt: string }> {
  if ((input.role === "customer") !== Boolean(input.customerId)) {
    throw new AppError("unprocessable", input.role === "customer" ? "Choose the customer account for a customer user" : "Only customer users are bound to a customer account");
  }
  const token = newToken();
  const created = await withScope(scope, async (tx) => {
    const tenant = await tx.selectFrom("tenants").select("name").where("id", "=", scope.tenantId).executeTakeFirstOrThrow();
    if (input.customerId) {
      const customer = await tx.selectFrom("customers").select("id").where("id", "=", input.customerId).executeTakeFirst();
      if (!customer) throw new AppError("not_found", "Customer not found");
    }
    const row = await tx
      .insertInto("invitations")
      .values({
        tenant_id: scope.tenantId,
        email: input.email,
        role: input.role,
        customer_id: input.customerId,
        token_hash: sha256(token),
        invited_by: scope.userId,
        expires_at: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
      })
      .returning(["id", "expires_at"])
      .executeTakeFirstOrThrow();
    const message = linkMessage(
      [`${scope.actorLabel} invited you to ${tenant.name} on Lotwarden as ${ROLE_LABELS[input.role].toLowerCase()}.`, `The link works once and expires in ${INVITATION_DAYS} days.`],
      { label: "Accept the invitation", path: `/invite/${token}` },
    );
    await enqueueEmail(tx, { tenantId: scope.tenantId, kind: "invitation", to: input.email, subject: `Your invitation to ${tenant.name} on Lotwarden`, ...message });
    await recordAudit(tx, scope, "invitation.created", { type: "invitation", id: row.id }, { email: input.email, role: input.role });
    return { id: row.id, expiresAt: row.expires_at.toISOString() };
  });
  kickMailer();
  return created;
}

export interface PendingInvitation {
  id: string;
  tenantId: string;
  tenantName: string;
  email: string;
  role: Role;
  customerId: string | null;
  existingUser: boolean;
}

/** The invitation behind a token, if it is still usable (not accepted, revoked or expired). */
export async function findInvitation(token: string): Promise<PendingInvitation | null> {
  const found = await withLookup({ invitationTokenHash: sha256(token) }, (tx) =>
    tx
      .selectFrom("invitations as i")
      .select(["i.id", "i.tenant_id", "i.email", "i.role", "i.customer_id", "i.expires_at", "i.accepted_at", "i.revoked_at"])
      .where("i.token_hash", "=", sha256(token))
      .executeTakeFirst(),
  );
  if (!found || found.accepted_at || found.revoked_at || found.expires_at.getTime() < Date.now()) return null;
  const scope = systemScope(found.tenant_id, "invitation");
  const tenantName = await withScope(scope, async (tx) => (await tx.selectFrom("tenants").select("name").where("id", "=", found.tenant_id).executeTakeFirstOrThrow()).name);
  const user = await withGlobal((tx) => tx.selectFrom("users").select("id").where(sql`lower(email)`, "=", found.email.toLowerCase()).executeTakeFirst());
  return { id: found.id, tenantId: found.tenant_id, tenantName, email: found.email, role: found.role, customerId: found.customer_id, existingUser: Boolean(user) };
}

/**
 * Accepts an invitation: a new user sets name and password; someone who already has an account proves it with
 * their password. Adds the membership, uses up the token, and signs them in.
 */
export async function acceptInvitation(input: { token: string; name: string; password: string }): Promise<CookieSpec> {
  const invitation = await findInvitation(input.token);
  if (!invitation) throw new AppError("not_found", "This invitation is not valid any more: it was used, withdrawn or has expired.");
  const existing = await withGlobal((tx) =>
    tx.selectFrom("users").select(["id", "password_hash"]).where(sql`lower(email)`, "=", invitation.email.toLowerCase()).executeTakeFirst(),
  );
  let userId: string;
  if (existing) {
    if (!(await verifyPassword(existing.password_hash, input.password))) throw new AppError("unauthenticated", "You already have a Lotwarden account: enter its password to accept.");
    userId = existing.id;
  } else {
    const passwordHash = await hashPassword(input.password);
    userId = (await withGlobal((tx) =>
      tx.insertInto("users").values({ email: invitation.email, name: input.name, password_hash: passwordHash, password_changed_at: new Date() }).returning("id").executeTakeFirstOrThrow(),
    )).id;
  }
  const scope = { ...systemScope(invitation.tenantId, input.name), userId };
  await withScope(scope, async (tx) => {
    const used = await tx
      .updateTable("invitations")
      .set({ accepted_at: new Date() })
      .where("id", "=", invitation.id)
      .where("accepted_at", "is", null)
      .returning("id")
      .executeTakeFirst();
    if (!used) throw new AppError("conflict", "This invitation was just used.");
    await tx
      .insertInto("memberships")
      .values({ tenant_id: invitation.tenantId, user_id: userId, role: invitation.role, customer_id: invitation.customerId })
      .onConflict((oc) => oc.columns(["tenant_id", "user_id"]).doUpdateSet({ role: invitation.role, customer_id: invitation.customerId }))
      .execute();
    await recordAudit(tx, scope, "invitation.accepted", { type: "invitation", id: invitation.id }, { email: invitation.email, role: invitation.role });
  });
  return createSession(userId, invitation.tenantId);
}
