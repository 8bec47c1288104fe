import { describe, expect, it } from "vitest";
import { can, PERMISSIONS, ROLES } from "./permissions";

describe("the role-permission table (§2)", () => {
  it("lets an admin do everything an engineer can, plus members, keys, customers and settings", () => {
    for (const permission of Object.keys(PERMISSIONS) as (keyof typeof PERMISSIONS)[]) {
      if (can("engineer", permission)) expect(can("admin", permission)).toBe(true);
    }
    for (const p of ["members.manage", "invitations.manage", "apikeys.manage", "customers.manage", "tenant.settings"] as const) {
      expect(can("admin", p)).toBe(true);
      expect(can("engineer", p)).toBe(false);
    }
  });

  it("keeps analysts read-only apart from comments, exports and saved views", () => {
    for (const p of ["lots.upload", "lots.disposition", "products.edit", "limits.freeze", "excursions.manage", "dies.ink", "devicemodels.edit"] as const) {
      expect(can("analyst", p)).toBe(false);
    }
    for (const p of ["data.read", "data.export", "views.save", "excursions.comment"] as const) expect(can("analyst", p)).toBe(true);
  });

  it("gives a customer nothing but their own reports and their tenant's name", () => {
    const allowed = (Object.keys(PERMISSIONS) as (keyof typeof PERMISSIONS)[]).filter((p) => can("customer", p));
    expect(allowed.sort()).toEqual(["reports.read", "tenant.read"]);
  });

  it("names only the four roles of §2", () => {
    expect(ROLES).toEqual(["admin", "engineer", "analyst", "customer"]);
    for (const roles of Object.values(PERMISSIONS)) for (const r of roles) expect(ROLES).toContain(r);
  });
});
