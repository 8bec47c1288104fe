import "server-only";
import type { Kysely } from "kysely";
import { AppError } from "../../http/errors";
import type { Scope } from "../scope";
import type { Database } from "../schema";
import { recordAudit } from "./audit";

export interface Watcher {
  userId: string;
  name: string;
  email: string;
}

const WATCHING_ROLES = ["admin", "engineer"] as const;

/** A product's explicit watch list: engineers and admins of the tenant who asked to hear of its excursions. */
export async function listWatchers(tx: Kysely<Database>, productId: string): Promise<Watcher[]> {
  const rows = await tx
    .selectFrom("product_watchers as w")
    .innerJoin("memberships as m", (j) => j.onRef("m.tenant_id", "=", "w.tenant_id").onRef("m.user_id", "=", "w.user_id"))
    .innerJoin("users as u", "u.id", "w.user_id")
    .select(["u.id", "u.name", "u.email"])
    .where("w.product_id", "=", productId)
    .where("m.role", "in", [...WATCHING_ROLES])
    .orderBy("u.name")
    .execute();
  return rows.map((r) => ({ userId: r.id, name: r.name, email: r.email }));
}

/**
 * Who hears of a new excursion on a product: its watch list, or, while that list is empty, every engineer and
 * admin of the tenant (so nobody has to set up a list before the first excursion reaches someone).
 */
export async function excursionRecipients(tx: Kysely<Database>, productId: string): Promise<Watcher[]> {
  const watchers = await listWatchers(tx, productId);
  if (watchers.length > 0) return watchers;
  const rows = await tx
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["u.id", "u.name", "u.email"])
    .where("m.tenant_id", "=", (eb) => eb.selectFrom("products").select("tenant_id").where("id", "=", productId).limit(1))
    .where("m.role", "in", [...WATCHING_ROLES])
    .orderBy("u.name")
    .execute();
  return rows.map((r) => ({ userId: r.id, name: r.name, email: r.email }));
}

/** Adds or removes the signed-in engineer or admin on a product's watch list. */
export async function setWatching(tx: Kysely<Database>, scope: Scope, product: { id: string; code: string }, watching: boolean): Promise<void> {
  if (!scope.userId) throw new AppError("forbidden", "Only a signed-in person can watch a product");
  if (watching) {
    await tx.insertInto("product_watchers").values({ tenant_id: scope.tenantId, product_id: product.id, user_id: scope.userId }).onConflict((oc) => oc.doNothing()).execute();
  } else {
    await tx.deleteFrom("product_watchers").where("product_id", "=", product.id).where("user_id", "=", scope.userId).execute();
  }
  await recordAudit(tx, scope, watching ? "product.watched" : "product.unwatched", { type: "product", id: product.code });
}
