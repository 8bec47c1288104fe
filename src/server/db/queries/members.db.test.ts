import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestTenant, ownerPool, type TestTenant } from "@/test/tenants";
import { type Scope, withScope } from "../scope";
import { createApiKey, revokeApiKey } from "./api-keys";
import { listAudit } from "./audit";
import { changeMemberRole, removeMember } from "./members";

const pool = ownerPool();
let tenant: TestTenant;
let admin: Scope;

beforeAll(async () => {
  tenant = await createTestTenant(pool, "members");
  admin = { tenantId: tenant.id, userId: tenant.users.admin!.id, role: "admin", customerId: null, actorLabel: "the admin" };
});
afterAll(() => pool.end());

describe("members, roles and keys, audited", () => {
  it("changes a role and records who did it", async () => {
    await withScope(admin, (tx) => changeMemberRole(tx, admin, tenant.users.analyst!.id, "engineer", null));
    const audit = await withScope(admin, (tx) => listAudit(tx, { subjectType: "user", subjectId: tenant.users.analyst!.id }));
    expect(audit[0]).toMatchObject({ action: "member.role_changed", actor: "the admin", details: { from: "analyst", to: "engineer" } });
  });

  it("refuses to demote or remove the last admin (threat: a tenant locked out of its own settings)", async () => {
    await expect(withScope(admin, (tx) => changeMemberRole(tx, admin, tenant.users.admin!.id, "analyst", null))).rejects.toThrow(/at least one admin/);
    await expect(withScope(admin, (tx) => removeMember(tx, admin, tenant.users.admin!.id))).rejects.toThrow(/at least one admin/);
  });

  it("binds a customer role to a customer account and nothing else", async () => {
    await expect(withScope(admin, (tx) => changeMemberRole(tx, admin, tenant.users.engineer!.id, "customer", null))).rejects.toThrow(/customer account/);
    await withScope(admin, (tx) => changeMemberRole(tx, admin, tenant.users.engineer!.id, "customer", tenant.customers[0]!.id));
  });

  it("shows a new key's secret once, keeps only its hash, and audits creation and revocation", async () => {
    const created = await withScope(admin, (tx) => createApiKey(tx, admin, { name: "PRB-09", role: "engineer", customerId: null }));
    expect(created.key).toMatch(/^lw_[a-z0-9]{10}_/);
    const stored = await pool.query("select secret_hash from api_keys where id = $1", [created.id]);
    expect(stored.rows[0].secret_hash).not.toContain(created.key.split("_").slice(2).join("_"));
    await withScope(admin, (tx) => revokeApiKey(tx, admin, created.id));
    const audit = await withScope(admin, (tx) => listAudit(tx, { subjectType: "api_key", subjectId: created.id }));
    expect(audit.map((a) => a.action)).toEqual(["api_key.revoked", "api_key.created"]);
  });
});
