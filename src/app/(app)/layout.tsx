import type { ReactNode } from "react";
import { can, type Permission, ROLE_LABELS } from "@/lib/permissions";
import { requireContext } from "@/server/auth/context";
import { type NavItem, NavRail } from "./nav-rail";

export const dynamic = "force-dynamic";

const NAV: (NavItem & { permission: Permission })[] = [
  { href: "/", label: "Home", permission: "tenant.read" },
  { href: "/lots", label: "Lots", permission: "data.read" },
  { href: "/uploads", label: "Uploads", permission: "lots.upload" },
  { href: "/products", label: "Products", permission: "data.read" },
  { href: "/excursions", label: "Excursions", permission: "data.read" },
  { href: "/docs/api", label: "API", permission: "tenant.read" },
  { href: "/settings/members", label: "Members", permission: "members.manage" },
  { href: "/settings/customers", label: "Customers", permission: "customers.manage" },
  { href: "/settings/api-keys", label: "API keys", permission: "apikeys.manage" },
  { href: "/settings/tenant", label: "Tenant settings", permission: "tenant.settings" },
];

export default async function AppLayout({ children }: { children: ReactNode }) {
  const context = await requireContext();
  const items = NAV.filter((item) => can(context.role, item.permission)).map(({ href, label }) => ({ href, label }));
  const tenants = context.memberships.map((m) => ({ id: m.tenantId, name: m.tenantName }));
  return (
    <div className="flex h-screen">
      <NavRail items={items} tenants={tenants} tenantId={context.tenantId} userName={context.user?.name ?? ""} roleLabel={ROLE_LABELS[context.role]} />
      <div className="min-w-0 flex-1 overflow-y-auto">
        <div className="mx-auto max-w-[1400px] px-8 py-6">{children}</div>
      </div>
    </div>
  );
}
