import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader, Panel } from "@/components/ui/page-header";
import { requireContext } from "@/server/auth/context";
import { listProducts } from "@/server/db/queries/products";
import { excursionRecipients, listWatchers } from "@/server/db/queries/watchers";
import { withScope } from "@/server/db/scope";
import { TenantForm } from "./tenant-form";

export const metadata: Metadata = { title: "Tenant settings" };

export default async function TenantSettingsPage() {
  const context = await requireContext("tenant.settings");
  const { tenant, products, customerUsers } = await withScope(context.scope, async (tx) => {
    const list = await listProducts(tx);
    const rows = await tx.selectFrom("products").select(["id", "code"]).execute();
    const ids = new Map(rows.map((r) => [r.code, r.id]));
    return {
      tenant: await tx.selectFrom("tenants").select(["name", "error_budget_fraction"]).where("id", "=", context.tenantId).executeTakeFirstOrThrow(),
      products: await Promise.all(
        list.map(async (p) => {
          const id = ids.get(p.code)!;
          const explicit = await listWatchers(tx, id);
          return { code: p.code, customer: p.customerName, explicit: explicit.length > 0, recipients: await excursionRecipients(tx, id) };
        }),
      ),
      customerUsers: await tx
        .selectFrom("memberships as m")
        .innerJoin("users as u", "u.id", "m.user_id")
        .innerJoin("customers as c", (j) => j.onRef("c.tenant_id", "=", "m.tenant_id").onRef("c.id", "=", "m.customer_id"))
        .select(["c.name as customer", "u.name", "u.email"])
        .where("m.role", "=", "customer")
        .orderBy("c.name")
        .execute(),
    };
  });
  return (
    <>
      <PageHeader eyebrow="Settings" title="Tenant" />
      <div className="grid gap-6 xl:grid-cols-2">
        <Panel title="Tenant">
          <TenantForm name={tenant.name} errorBudgetPercent={Number((tenant.error_budget_fraction * 100).toPrecision(6))} />
        </Panel>
        <Panel title="Who receives which e-mail">
          <h3 className="text-sm font-semibold">New excursion</h3>
          <p className="mt-1 text-xs text-ink-muted">The product&apos;s watch list (engineers and admins add themselves on the product page); while a product has none, every engineer and admin.</p>
          <ul className="mt-2 space-y-1 text-sm">
            {products.map((p) => (
              <li key={p.code}>
                <Link className="font-medium text-accent underline-offset-2 hover:underline" href={`/products/${encodeURIComponent(p.code)}`}>{p.code}</Link>{" "}
                <span className="text-ink-soft">{p.recipients.map((r) => r.name).join(", ") || "nobody"}{p.explicit ? "" : " (no watch list: all engineers and admins)"}</span>
              </li>
            ))}
          </ul>
          <h3 className="mt-4 text-sm font-semibold">Lot released</h3>
          <p className="mt-1 text-xs text-ink-muted">The customer&apos;s users, with a link to the lot report. Invite them from Members with the role “Customer”.</p>
          <ul className="mt-2 space-y-1 text-sm">
            {customerUsers.length === 0 ? <li className="text-ink-soft">No customer users yet.</li> : customerUsers.map((u) => <li key={u.email}><span className="font-medium">{u.customer}</span> <span className="text-ink-soft">{u.name} &lt;{u.email}&gt;</span></li>)}
          </ul>
          <h3 className="mt-4 text-sm font-semibold">Invitations and password resets</h3>
          <p className="mt-1 text-xs text-ink-muted">To the invited or resetting person only.</p>
        </Panel>
      </div>
    </>
  );
}
