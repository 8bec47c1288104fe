import "server-only";
import { randomBytes } from "node:crypto";
import type { Kysely } from "kysely";
import { systemScope, withLookup, withScope } from "../db/scope";
import type { Database, Role } from "../db/schema";
import { sameHash, sha256 } from "./secrets";

// A key reads `lw_<prefix>_<secret>`: the prefix finds the row and is shown in lists; only sha256(secret) is stored
// (the secret has 256 bits of entropy, so a fast hash is enough).
const KEY_PATTERN = /^lw_([a-z0-9]{10})_([A-Za-z0-9_-]{43})$/;

export function newApiKey(): { key: string; prefix: string; secretHash: string } {
  const prefix = randomBytes(8).toString("hex").slice(0, 10);
  const secret = randomBytes(32).toString("base64url");
  return { key: `lw_${prefix}_${secret}`, prefix, secretHash: sha256(secret) };
}

export interface ApiKeyIdentity {
  keyId: string;
  name: string;
  tenantId: string;
  role: Role;
  customerId: string | null;
}

/** Resolves a Bearer key to its tenant and role, or null (unknown, malformed, wrong secret or revoked). */
export async function resolveApiKey(key: string): Promise<ApiKeyIdentity | null> {
  const match = KEY_PATTERN.exec(key);
  if (!match) return null;
  const [, prefix, secret] = match as unknown as [string, string, string];
  const row = await withLookup({ apiKeyPrefix: prefix }, (tx: Kysely<Database>) =>
    tx
      .selectFrom("api_keys")
      .select(["id", "name", "tenant_id", "role", "customer_id", "secret_hash", "revoked_at", "last_used_at"])
      .where("prefix", "=", prefix)
      .executeTakeFirst(),
  );
  if (!row || row.revoked_at || !sameHash(row.secret_hash, sha256(secret))) return null;
  if (!row.last_used_at || Date.now() - row.last_used_at.getTime() > 60_000) {
    await withScope(systemScope(row.tenant_id, "api key bookkeeping"), (tx) =>
      tx.updateTable("api_keys").set({ last_used_at: new Date() }).where("id", "=", row.id).execute(),
    );
  }
  return { keyId: row.id, name: row.name, tenantId: row.tenant_id, role: row.role, customerId: row.customer_id };
}
