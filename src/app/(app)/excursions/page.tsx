import type { Metadata } from "next";
import { EmptyState, PageHeader, Panel } from "@/components/ui/page-header";
import { excursionFiltersSchema } from "@/lib/schemas/excursions";
import { can } from "@/lib/permissions";
import { requireContext } from "@/server/auth/context";
import { listExcursions } from "@/server/db/queries/excursions";
import { listProducts } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { ExcursionGrid } from "./excursion-grid";
import { RaiseExcursionForm } from "./raise-excursion-form";

export const metadata: Metadata = { title: "Excursions" };

export default async function ExcursionsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const context = await requireContext("data.read");
  const raw = await searchParams;
  const parsed = excursionFiltersSchema.safeParse({ status: raw.status, product: raw.product });
  const filters = parsed.success ? parsed.data : {};
  const { excursions, products } = await withScope(context.scope, async (tx) => ({ excursions: await listExcursions(tx, filters), products: await listProducts(tx) }));
  const canManage = can(context.role, "excursions.manage");
  return (
    <>
      <PageHeader eyebrow="Quality" title="Excursions" />
      <div className={`grid gap-6 ${canManage ? "xl:grid-cols-[1fr_340px]" : ""}`}>
        <Panel title={`${excursions.length} excursion${excursions.length === 1 ? "" : "s"}`}>
          <form className="mb-4 flex flex-wrap items-end gap-3 text-sm" method="get">
            <label className="text-ink-soft">
              Status
              <select name="status" defaultValue={filters.status ?? ""} className="ml-2 rounded border border-slate-line bg-white px-2 py-1">
                <option value="">Any</option>
                <option value="open">Open</option>
                <option value="acknowledged">Acknowledged</option>
                <option value="resolved">Resolved</option>
              </select>
            </label>
            <label className="text-ink-soft">
              Product
              <select name="product" defaultValue={filters.product ?? ""} className="ml-2 rounded border border-slate-line bg-white px-2 py-1">
                <option value="">Any</option>
                {products.map((p) => <option key={p.code} value={p.code}>{p.code}</option>)}
              </select>
            </label>
            <button type="submit" className="rounded border border-slate-line bg-slate-panel px-3 py-1 font-medium text-ink hover:bg-slate-wash">Filter</button>
          </form>
          {excursions.length === 0 ? <EmptyState>No excursions match. Excursions open by themselves when a control rule fires, a lot falls under its yield floor or a wafer shows an edge ring.</EmptyState> : <ExcursionGrid excursions={excursions} />}
        </Panel>
        {canManage ? (
          <Panel title="Raise an excursion by hand">
            <RaiseExcursionForm products={products.map((p) => p.code)} />
          </Panel>
        ) : null}
      </div>
    </>
  );
}
