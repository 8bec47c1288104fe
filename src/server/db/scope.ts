import "server-only";
import { type Kysely, sql, type Transaction } from "kysely";
import type { Role } from "./schema";
import type { Database } from "./schema";
import { db } from "./client";

/** Who a query runs for. Built only by the auth helpers (src/server/auth/context.ts), never from request input. */
export interface Scope {
  tenantId: string;
  userId: string | null;
  role: Role;
  customerId: string | null;
  actorLabel: string;
}

type Settings = Partial<Record<"app.tenant_id" | "app.customer_id" | "app.user_id" | "app.invitation_token_hash" | "app.api_key_prefix" | "app.mail_sender", string | null>>;

async function applySettings(tx: Transaction<Database>, settings: Settings): Promise<void> {
  const entries = Object.entries(settings);
  if (entries.length === 0) return;
  // set_config(..., true) lasts until the end of this transaction only, so a pooled connection never carries it on.
  const calls = entries.map(([name, value]) => sql`set_config(${name}, ${value ?? ""}, true)`);
  await sql`select ${sql.join(calls)}`.execute(tx);
}

/**
 * The one way to touch tenant data: a transaction in which row-level security sees only the scope's tenant (and,
 * for a customer, only what that customer may see). Everything inside is committed or nothing is.
 */
export function withScope<T>(scope: Scope, fn: (tx: Kysely<Database>) => Promise<T>): Promise<T> {
  return db.transaction().execute(async (tx) => {
    await applySettings(tx, { "app.tenant_id": scope.tenantId, "app.customer_id": scope.customerId, "app.user_id": scope.userId });
    return fn(tx);
  });
}

/** A scope for background work on one tenant's data (the ingest worker, the mail sender, key bookkeeping). */
export function systemScope(tenantId: string, actorLabel: string): Scope {
  return { tenantId, userId: null, role: "admin", customerId: null, actorLabel };
}

/** A transaction for a signed-in user before a tenant is chosen: only their own memberships and tenants are visible. */
export function withUser<T>(userId: string, fn: (tx: Kysely<Database>) => Promise<T>): Promise<T> {
  return db.transaction().execute(async (tx) => {
    await applySettings(tx, { "app.user_id": userId });
    return fn(tx);
  });
}

/** A transaction that can find exactly one invitation or API key by its secret, before any tenant is known. */
export function withLookup<T>(lookup: { invitationTokenHash?: string; apiKeyPrefix?: string }, fn: (tx: Kysely<Database>) => Promise<T>): Promise<T> {
  return db.transaction().execute(async (tx) => {
    await applySettings(tx, { "app.invitation_token_hash": lookup.invitationTokenHash ?? null, "app.api_key_prefix": lookup.apiKeyPrefix ?? null });
    return fn(tx);
  });
}

/** Global tables only (users, sessions, security events, outbox): tenant tables answer nothing here. */
export function withGlobal<T>(fn: (tx: Kysely<Database>) => Promise<T>): Promise<T> {
  return db.transaction().execute(fn);
}

/** The outbox sender's transaction: it alone sees every tenant's queued mail. */
export function withMailSender<T>(fn: (tx: Kysely<Database>) => Promise<T>): Promise<T> {
  return db.transaction().execute(async (tx) => {
    await applySettings(tx, { "app.mail_sender": "on" });
    return fn(tx);
  });
}
