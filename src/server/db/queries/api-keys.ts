import "server-only";
import type { Kysely } from "kysely";
import type { Role } from "@/lib/permissions";
import type { ApiKeyView } from "@/lib/schemas/members";
import { newApiKey } from "../../auth/api-key";
import { AppError } from "../../http/errors";
import type { Scope } from "../scope";
import type { Database } from "../schema";
import { recordAudit } from "./audit";

export async function listApiKeys(tx: Kysely<Database>): Promise<ApiKeyView[]> {
  const rows = await tx
    .selectFrom("api_keys as k")
    .leftJoin("users as u", "u.id", "k.created_by")
    .select(["k.id", "k.name", "k.role", "k.prefix", "u.name as creator", "k.created_at", "k.last_used_at", "k.revoked_at"])
    .orderBy("k.created_at", "desc")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    role: r.role,
    prefix: `lw_${r.prefix}`,
    createdBy: r.creator,
    createdAt: r.created_at.toISOString(),
    lastUsedAt: r.last_used_at?.toISOString() ?? null,
    revokedAt: r.revoked_at?.toISOString() ?? null,
  }));
}

/** Creates a key and returns its secret, the only time it is ever shown. */
export async function createApiKey(tx: Kysely<Database>, scope: Scope, input: { name: string; role: Role; customerId: string | null }): Promise<{ id: string; key: string }> {
  if ((input.role === "customer") !== Boolean(input.customerId)) throw new AppError("unprocessable", "A customer key needs a customer account, and only it does");
  const { key, prefix, secretHash } = newApiKey();
  const row = await tx
    .insertInto("api_keys")
    .values({ tenant_id: scope.tenantId, name: input.name, role: input.role, customer_id: input.customerId, prefix, secret_hash: secretHash, created_by: scope.userId })
    .returning("id")
    .executeTakeFirstOrThrow();
  await recordAudit(tx, scope, "api_key.created", { type: "api_key", id: row.id }, { name: input.name, role: input.role, prefix: `lw_${prefix}` });
  return { id: row.id, key };
}

export async function revokeApiKey(tx: Kysely<Database>, scope: Scope, id: string): Promise<void> {
  const row = await tx.updateTable("api_keys").set({ revoked_at: new Date() }).where("id", "=", id).where("revoked_at", "is", null).returning("name").executeTakeFirst();
  if (!row) throw new AppError("not_found", "API key not found");
  await recordAudit(tx, scope, "api_key.revoked", { type: "api_key", id }, { name: row.name });
}
