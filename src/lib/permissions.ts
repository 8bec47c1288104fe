// Authorisation in one place: what each role may do (§2). Checked by every route and action through the same
// helper (src/server/auth/context.ts); the UI reads it only to hide what a role cannot use.
export const ROLES = ["admin", "engineer", "analyst", "customer"] as const;
export type Role = (typeof ROLES)[number];

const STAFF = ["admin", "engineer", "analyst"] as const;
const ENGINEERS = ["admin", "engineer"] as const;

export const PERMISSIONS = {
  "tenant.read": ROLES,
  "reports.read": ROLES,
  "data.read": STAFF,
  "data.export": STAFF,
  "views.save": STAFF,
  "excursions.comment": STAFF,
  "lots.upload": ENGINEERS,
  "lots.disposition": ENGINEERS,
  "dies.ink": ENGINEERS,
  "products.edit": ENGINEERS,
  "limits.freeze": ENGINEERS,
  "excursions.manage": ENGINEERS,
  "devicemodels.edit": ENGINEERS,
  "customers.manage": ["admin"],
  "members.manage": ["admin"],
  "invitations.manage": ["admin"],
  "apikeys.manage": ["admin"],
  "tenant.settings": ["admin"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Admin",
  engineer: "Process engineer",
  analyst: "Yield analyst",
  customer: "Customer",
};
