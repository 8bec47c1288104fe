import "server-only";
import type { Kysely } from "kysely";
import type { SavedView } from "@/lib/schemas/views";
import { AppError } from "../../http/errors";
import type { Scope } from "../scope";
import type { Database } from "../schema";

/** The signed-in person's own saved views (row-level security adds the owner check), newest first. */
export async function listViews(tx: Kysely<Database>, path?: string): Promise<SavedView[]> {
  let q = tx.selectFrom("saved_views").select(["id", "name", "path", "query", "created_at"]).orderBy("created_at", "desc").limit(100);
  if (path) q = q.where("path", "=", path);
  return (await q.execute()).map((v) => ({ id: v.id, name: v.name, href: v.query ? `${v.path}?${v.query}` : v.path, createdAt: v.created_at.toISOString() }));
}

export async function saveView(tx: Kysely<Database>, scope: Scope, input: { name: string; path: string; query: string }): Promise<SavedView> {
  if (!scope.userId) throw new AppError("forbidden", "Views belong to people, not API keys");
  const row = await tx.insertInto("saved_views").values({ tenant_id: scope.tenantId, user_id: scope.userId, ...input }).returning(["id", "created_at"]).executeTakeFirstOrThrow();
  return { id: row.id, name: input.name, href: input.query ? `${input.path}?${input.query}` : input.path, createdAt: row.created_at.toISOString() };
}

export async function deleteView(tx: Kysely<Database>, id: string): Promise<void> {
  const result = await tx.deleteFrom("saved_views").where("id", "=", id).executeTakeFirst();
  if (Number(result.numDeletedRows) === 0) throw new AppError("not_found", "View not found");
}
