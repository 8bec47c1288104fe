import "server-only";
import { NodePostgresAdapter } from "@lucia-auth/adapter-postgresql";
import { type Cookie, Lucia, TimeSpan } from "lucia";
import { pool } from "../db/client";
import { env } from "../env";

// All of the session library lives in this module, so it can be swapped without touching callers.
const localHosts = new Set(["127.0.0.1", "localhost", "[::1]"]);

export const SESSION_COOKIE = "lotwarden_session";

export const lucia = new Lucia(new NodePostgresAdapter(pool, { user: "users", session: "user_sessions" }), {
  sessionExpiresIn: new TimeSpan(14, "d"),
  sessionCookie: {
    name: SESSION_COOKIE,
    attributes: { secure: !localHosts.has(new URL(env.APP_URL).hostname), sameSite: "lax" },
  },
  getSessionAttributes: (attributes) => ({ tenantId: attributes.active_tenant_id }),
  getUserAttributes: (attributes) => ({ email: attributes.email, name: attributes.name }),
});

declare module "lucia" {
  interface Register {
    Lucia: typeof lucia;
    DatabaseSessionAttributes: { active_tenant_id: string | null };
    DatabaseUserAttributes: { email: string; name: string };
  }
}

export type CookieSpec = Cookie;

export async function createSession(userId: string, tenantId: string | null): Promise<CookieSpec> {
  const session = await lucia.createSession(userId, { active_tenant_id: tenantId });
  return lucia.createSessionCookie(session.id);
}

export function blankSessionCookie(): CookieSpec {
  return lucia.createBlankSessionCookie();
}

/** Validates a session id; `refreshed` carries a new cookie when the session was extended. */
export async function validateSession(sessionId: string) {
  const { session, user } = await lucia.validateSession(sessionId);
  if (!session) return null;
  return { session, user, refreshed: session.fresh ? lucia.createSessionCookie(session.id) : null };
}

export function invalidateSession(sessionId: string): Promise<void> {
  return lucia.invalidateSession(sessionId);
}

/** Signs a user out everywhere (password change or reset). */
export function invalidateUserSessions(userId: string): Promise<void> {
  return lucia.invalidateUserSessions(userId);
}
