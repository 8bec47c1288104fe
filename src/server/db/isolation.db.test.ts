import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestTenant, ownerPool, type TestTenant } from "@/test/tenants";
import { db } from "./client";
import { type Scope, withScope } from "./scope";

const pool = ownerPool();
let a: TestTenant;
let b: TestTenant;
const scopeOf = (t: TestTenant): Scope => ({ tenantId: t.id, userId: t.users.admin!.id, role: "admin", customerId: null, actorLabel: "test" });

beforeAll(async () => {
  a = await createTestTenant(pool, "iso-a");
  b = await createTestTenant(pool, "iso-b");
});
afterAll(() => pool.end());

describe("tenant isolation in depth (threat: a query that forgets its tenant filter)", () => {
  it("returns only the scope's own rows from a query with no where clause at all", async () => {
    for (const table of ["customers", "memberships", "api_keys", "invitations", "audit_events"] as const) {
      const rows = await withScope(scopeOf(a), (tx) => tx.selectFrom(table).select("tenant_id").execute());
      expect(rows.every((r) => r.tenant_id === a.id), table).toBe(true);
    }
    const customers = await withScope(scopeOf(a), (tx) => sql<{ id: string }>`select id from customers`.execute(tx));
    expect(customers.rows.map((r) => r.id).sort()).toEqual(a.customers.map((c) => c.id).sort());
  });

  it("returns nothing from tenant tables when no tenant context is set", async () => {
    const rows = await sql<{ n: string }>`select count(*) as n from customers`.execute(db);
    expect(Number(rows.rows[0]!.n)).toBe(0);
    const keys = await db.selectFrom("api_keys").select("id").execute();
    expect(keys).toEqual([]);
  });

  it("refuses to write a row into another tenant from inside a scope (threat: a forged tenant id)", async () => {
    await expect(
      withScope(scopeOf(a), (tx) => tx.insertInto("customers").values({ tenant_id: b.id, name: "smuggled" }).execute()),
    ).rejects.toThrow(/row-level security/);
  });

  it("cannot update or delete another tenant's rows by id (threat: guessing ids)", async () => {
    const foreign = b.customers[0]!.id;
    const updated = await withScope(scopeOf(a), (tx) => tx.updateTable("customers").set({ name: "taken" }).where("id", "=", foreign).executeTakeFirst());
    expect(Number(updated.numUpdatedRows)).toBe(0);
    const deleted = await withScope(scopeOf(a), (tx) => tx.deleteFrom("customers").where("id", "=", foreign).executeTakeFirst());
    expect(Number(deleted.numDeletedRows)).toBe(0);
  });

  it("connects as a role that is no superuser, cannot bypass RLS and owns no table (threat: a privileged app connection)", async () => {
    const role = await sql<{ rolsuper: boolean; rolbypassrls: boolean; name: string }>`select rolsuper, rolbypassrls, current_user as name from pg_roles where rolname = current_user`.execute(db);
    expect(role.rows[0]).toMatchObject({ rolsuper: false, rolbypassrls: false });
    const owned = await sql<{ n: string }>`select count(*) as n from pg_tables where schemaname = 'public' and tableowner = current_user`.execute(db);
    expect(Number(owned.rows[0]!.n)).toBe(0);
  });

  it("forces row-level security on every table that has a tenant_id column", async () => {
    const tables = await sql<{ relname: string; relrowsecurity: boolean; relforcerowsecurity: boolean }>`
      select c.relname, c.relrowsecurity, c.relforcerowsecurity
      from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where n.nspname = 'public' and c.relkind = 'r'
        and exists (select 1 from information_schema.columns col where col.table_schema = 'public' and col.table_name = c.relname and col.column_name = 'tenant_id')`.execute(db);
    expect(tables.rows.length).toBeGreaterThan(3);
    for (const t of tables.rows) expect([t.relname, t.relrowsecurity, t.relforcerowsecurity]).toEqual([t.relname, true, true]);
  });

  it("does not carry a tenant setting over to the next transaction on a pooled connection", async () => {
    await withScope(scopeOf(a), (tx) => tx.selectFrom("customers").select("id").execute());
    const after = await sql<{ t: string | null }>`select current_setting('app.tenant_id', true) as t`.execute(db);
    expect(after.rows[0]!.t ?? "").toBe("");
  });
});
