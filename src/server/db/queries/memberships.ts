import "server-only";
import type { Kysely } from "kysely";
import type { MemberView } from "@/lib/schemas/members";
import type { Database, Role } from "../schema";

export interface MembershipSummary {
  tenantId: string;
  tenantName: string;
  tenantSlug: string;
  role: Role;
  customerId: string | null;
}

/** The signed-in user's memberships in every tenant (run inside withUser). */
export async function listUserMemberships(tx: Kysely<Database>, userId: string): Promise<MembershipSummary[]> {
  const rows = await tx
    .selectFrom("memberships as m")
    .innerJoin("tenants as t", "t.id", "m.tenant_id")
    .select(["m.tenant_id", "t.name", "t.slug", "m.role", "m.customer_id"])
    .where("m.user_id", "=", userId)
    .orderBy("t.name")
    .execute();
  return rows.map((r) => ({ tenantId: r.tenant_id, tenantName: r.name, tenantSlug: r.slug, role: r.role, customerId: r.customer_id }));
}

export async function listMembers(tx: Kysely<Database>): Promise<MemberView[]> {
  const rows = await tx
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .leftJoin("customers as c", (j) => j.onRef("c.id", "=", "m.customer_id").onRef("c.tenant_id", "=", "m.tenant_id"))
    .select(["m.user_id", "u.email", "u.name", "m.role", "m.customer_id", "c.name as customer_name", "m.created_at"])
    .orderBy("u.name")
    .execute();
  return rows.map((r) => ({
    userId: r.user_id,
    email: r.email,
    name: r.name,
    role: r.role,
    customerId: r.customer_id,
    customerName: r.customer_name,
    joinedAt: r.created_at.toISOString(),
  }));
}
