import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestTenant, ownerPool, type TestTenant } from "@/test/tenants";
import { type Scope, withScope } from "../scope";
import { deleteView, listViews, saveView } from "./views";

const pool = ownerPool();
let tenant: TestTenant;
const scopeOf = (who: string): Scope => ({ tenantId: tenant.id, userId: tenant.users[who]!.id, role: "analyst", customerId: null, actorLabel: who });

beforeAll(async () => {
  tenant = await createTestTenant(pool, "views");
});
afterAll(() => pool.end());

describe("saved views", () => {
  it("keeps a person's views to that person, even for a colleague in the same tenant (threat: reading someone's saved work)", async () => {
    const mine = await withScope(scopeOf("analyst"), (tx) => saveView(tx, scopeOf("analyst"), { name: "W3 shorts", path: "/lots/TW1", query: "wafer=3&colour=bin" }));
    expect(mine.href).toBe("/lots/TW1?wafer=3&colour=bin");
    expect((await withScope(scopeOf("analyst"), (tx) => listViews(tx, "/lots/TW1"))).map((v) => v.name)).toEqual(["W3 shorts"]);
    expect(await withScope(scopeOf("engineer"), (tx) => listViews(tx))).toEqual([]);
    await expect(withScope(scopeOf("engineer"), (tx) => deleteView(tx, mine.id))).rejects.toThrow(/not found/);
    await withScope(scopeOf("analyst"), (tx) => deleteView(tx, mine.id));
    expect(await withScope(scopeOf("analyst"), (tx) => listViews(tx))).toEqual([]);
  });
});
