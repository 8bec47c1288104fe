import "server-only";
import type { Kysely } from "kysely";
import { AppError } from "../../http/errors";
import type { Scope } from "../scope";
import type { Database } from "../schema";
import { recordAudit } from "./audit";

export interface Customer {
  id: string;
  name: string;
}

/** The tenant's customer accounts; a customer user sees only their own. */
export async function listCustomers(tx: Kysely<Database>, scope: Scope): Promise<Customer[]> {
  let q = tx.selectFrom("customers").select(["id", "name"]).orderBy("name");
  if (scope.customerId) q = q.where("id", "=", scope.customerId);
  return q.execute();
}

export async function createCustomer(tx: Kysely<Database>, scope: Scope, name: string): Promise<Customer> {
  const exists = await tx.selectFrom("customers").select("id").where("name", "=", name).executeTakeFirst();
  if (exists) throw new AppError("conflict", `A customer named "${name}" already exists`);
  const row = await tx.insertInto("customers").values({ tenant_id: scope.tenantId, name }).returning(["id", "name"]).executeTakeFirstOrThrow();
  await recordAudit(tx, scope, "customer.created", { type: "customer", id: row.id }, { name });
  return row;
}
