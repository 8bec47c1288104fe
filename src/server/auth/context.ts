import "server-only";
import { cookies, headers } from "next/headers";
import { notFound, redirect } from "next/navigation";
import { cache } from "react";
import { can, type Permission, type Role } from "@/lib/permissions";
import { listUserMemberships, type MembershipSummary } from "../db/queries/memberships";
import { type Scope, withGlobal, withUser } from "../db/scope";
import { resolveApiKey } from "./api-key";
import { SESSION_COOKIE, validateSession } from "./session";

export interface AuthContext {
  via: "session" | "api_key";
  user: { id: string; email: string; name: string } | null;
  sessionId: string | null;
  tenantId: string;
  tenantName: string;
  role: Role;
  customerId: string | null;
  memberships: MembershipSummary[];
  scope: Scope;
}

async function fromApiKey(key: string): Promise<AuthContext | null> {
  const identity = await resolveApiKey(key);
  if (!identity) return null;
  const label = `API key "${identity.name}"`;
  return {
    via: "api_key",
    user: null,
    sessionId: null,
    tenantId: identity.tenantId,
    tenantName: "",
    role: identity.role,
    customerId: identity.customerId,
    memberships: [],
    scope: { tenantId: identity.tenantId, userId: null, role: identity.role, customerId: identity.customerId, actorLabel: label },
  };
}

async function fromSession(sessionId: string): Promise<AuthContext | null> {
  const validated = await validateSession(sessionId);
  if (!validated) return null;
  const { session, user, refreshed } = validated;
  if (refreshed) {
    // Route handlers and actions can extend the cookie; a server component render cannot, and the proxy does it then.
    try {
      (await cookies()).set(refreshed.name, refreshed.value, refreshed.attributes);
    } catch {
      /* rendering: the proxy refreshes the cookie */
    }
  }
  const memberships = await withUser(user.id, (tx) => listUserMemberships(tx, user.id));
  const active = memberships.find((m) => m.tenantId === session.tenantId) ?? memberships[0];
  if (!active) return null; // a user without any membership has nothing to see
  if (active.tenantId !== session.tenantId) {
    await withGlobal((tx) => tx.updateTable("user_sessions").set({ active_tenant_id: active.tenantId }).where("id", "=", session.id).execute());
  }
  return {
    via: "session",
    user: { id: user.id, email: user.email, name: user.name },
    sessionId: session.id,
    tenantId: active.tenantId,
    tenantName: active.tenantName,
    role: active.role,
    customerId: active.customerId,
    memberships,
    scope: { tenantId: active.tenantId, userId: user.id, role: active.role, customerId: active.customerId, actorLabel: user.name || user.email },
  };
}

/** The caller of this request, from the Bearer key or the session cookie; memoised for the request. */
export const getAuthContext = cache(async (): Promise<AuthContext | null> => {
  const authorization = (await headers()).get("authorization");
  if (authorization) {
    return authorization.startsWith("Bearer ") ? fromApiKey(authorization.slice(7).trim()) : null;
  }
  const sessionId = (await cookies()).get(SESSION_COOKIE)?.value;
  return sessionId ? fromSession(sessionId) : null;
});

/**
 * For pages and layouts: the signed-in context, or a redirect to sign-in. A role without the permission gets the
 * 404 page, as for an object that is not theirs (§2).
 */
export async function requireContext(permission: Permission = "tenant.read"): Promise<AuthContext> {
  const context = await getAuthContext();
  if (!context) redirect("/sign-in");
  if (!can(context.role, permission)) notFound();
  return context;
}
