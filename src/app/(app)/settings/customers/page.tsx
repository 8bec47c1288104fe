import type { Metadata } from "next";
import { EmptyState, PageHeader, Panel } from "@/components/ui/page-header";
import { requireContext } from "@/server/auth/context";
import { listCustomers } from "@/server/db/queries/customers";
import { withScope } from "@/server/db/scope";
import { CustomerForm } from "./customer-form";

export const metadata: Metadata = { title: "Customers" };

export default async function CustomersPage() {
  const context = await requireContext("customers.manage");
  const rows = await withScope(context.scope, async (tx) => {
    const customers = await listCustomers(tx, context.scope);
    const counts = await tx
      .selectFrom("customers as c")
      .leftJoin("products as p", (j) => j.onRef("p.tenant_id", "=", "c.tenant_id").onRef("p.customer_id", "=", "c.id"))
      .leftJoin("memberships as m", (j) => j.onRef("m.tenant_id", "=", "c.tenant_id").onRef("m.customer_id", "=", "c.id"))
      .select(["c.id"])
      .select((eb) => [eb.fn.count<string>("p.id").distinct().as("products"), eb.fn.count<string>("m.user_id").distinct().as("users")])
      .groupBy("c.id")
      .execute();
    return customers.map((c) => ({ ...c, products: Number(counts.find((n) => n.id === c.id)?.products ?? 0), users: Number(counts.find((n) => n.id === c.id)?.users ?? 0) }));
  });
  return (
    <>
      <PageHeader eyebrow="Settings" title="Customers" />
      <div className="grid gap-6 xl:grid-cols-[1fr_360px]">
        <Panel title="Customer accounts">
          {rows.length === 0 ? (
            <EmptyState>No customers yet. A customer account owns products; its users see only its released lots.</EmptyState>
          ) : (
            <table className="w-full text-left text-sm">
              <thead className="border-b border-slate-line text-xs uppercase tracking-wide text-ink-muted"><tr><th className="py-2 font-medium">Name</th><th className="font-medium">Products</th><th className="font-medium">Users</th></tr></thead>
              <tbody className="divide-y divide-slate-line">{rows.map((c) => <tr key={c.id}><td className="py-2 font-medium">{c.name}</td><td className="tabular">{c.products}</td><td className="tabular">{c.users}</td></tr>)}</tbody>
            </table>
          )}
          <p className="mt-3 text-xs text-ink-muted">Invite a customer&apos;s people from Members, choosing the role “Customer” and this account.</p>
        </Panel>
        <Panel title="New customer">
          <CustomerForm />
        </Panel>
      </div>
    </>
  );
}
