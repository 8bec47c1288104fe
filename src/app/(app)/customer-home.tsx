import Link from "next/link";
import { EmptyState, PageHeader, Panel } from "@/components/ui/page-header";
import { formatDate, formatPercent } from "@/lib/format";
import type { AuthContext } from "@/server/auth/context";
import { listCustomers } from "@/server/db/queries/customers";
import { listLots } from "@/server/db/queries/lots";
import { withScope } from "@/server/db/scope";

/** A customer's front door: only their own released lots, newest first (row-level security enforces it). */
export async function CustomerHome({ context }: { context: AuthContext }) {
  const { lots, customer } = await withScope(context.scope, async (tx) => ({
    lots: await listLots(tx, { page: 1, pageSize: 200, sort: "probedAt", order: "desc" }),
    customer: (await listCustomers(tx, context.scope))[0]?.name ?? "",
  }));
  return (
    <>
      <PageHeader eyebrow={`${context.tenantName} · lot reports for ${customer}`} title="Your released lots" />
      <Panel>
        {lots.lots.length === 0 ? (
          <EmptyState>No lots have been released to {customer} yet. Released lots and their reports appear here.</EmptyState>
        ) : (
          <table className="w-full text-left text-sm">
            <thead className="border-b border-slate-line text-xs uppercase tracking-wide text-ink-muted"><tr><th className="py-2 font-medium">Lot</th><th className="font-medium">Product</th><th className="font-medium">Wafers</th><th className="font-medium">Yield</th><th className="font-medium">Probed</th><th className="font-medium">Report</th></tr></thead>
            <tbody className="divide-y divide-slate-line">
              {lots.lots.map((l) => (
                <tr key={l.lot}>
                  <td className="py-2 font-medium">{l.lot}</td>
                  <td>{l.product}</td>
                  <td className="tabular">{l.wafers}</td>
                  <td className="tabular">{formatPercent(l.yield)}</td>
                  <td className="tabular">{formatDate(l.probedAt)}</td>
                  <td><Link className="text-accent underline" href={`/lots/${encodeURIComponent(l.lot)}/report`}>Lot report</Link></td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Panel>
    </>
  );
}
