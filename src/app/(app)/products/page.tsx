import type { Metadata } from "next";
import Link from "next/link";
import { EmptyState, PageHeader, Panel } from "@/components/ui/page-header";
import { formatConductance, formatPercent } from "@/lib/format";
import { can } from "@/lib/permissions";
import { requireContext } from "@/server/auth/context";
import { listCustomers } from "@/server/db/queries/customers";
import { listProducts } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { ProductForm } from "./product-form";

export const metadata: Metadata = { title: "Products" };

export default async function ProductsPage() {
  const context = await requireContext("data.read");
  const { products, customers } = await withScope(context.scope, async (tx) => ({ products: await listProducts(tx), customers: await listCustomers(tx, context.scope) }));
  const editor = can(context.role, "products.edit");
  return (
    <>
      <PageHeader eyebrow={context.tenantName} title="Products" />
      <Panel>
        {products.length === 0 ? (
          <EmptyState>No products yet. {editor ? "Create one below, then upload its probe lots." : "An engineer creates products."}</EmptyState>
        ) : (
          <table className="w-full text-left text-sm">
            <thead className="border-b border-slate-line text-xs uppercase tracking-wide text-ink-muted">
              <tr>
                <th className="py-2 font-medium">Code</th>
                <th className="font-medium">Name</th>
                <th className="font-medium">Customer</th>
                <th className="font-medium">Spec window</th>
                <th className="font-medium">Die</th>
                <th className="font-medium">Yield floor</th>
                <th className="font-medium">Rules</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-slate-line">
              {products.map((p) => (
                <tr key={p.code} className="hover:bg-slate-wash">
                  <td className="py-2 font-medium"><Link className="text-accent underline-offset-2 hover:underline" href={`/products/${encodeURIComponent(p.code)}`}>{p.code}</Link></td>
                  <td>{p.name}</td>
                  <td>{p.customerName ?? "—"}</td>
                  <td className="tabular">{formatConductance(p.specLowS, p.displayUnit)} – {formatConductance(p.specHighS, p.displayUnit)}</td>
                  <td className="tabular">{p.dieWidthMm} × {p.dieHeightMm} mm on {p.waferDiameterMm} mm</td>
                  <td className="tabular">{formatPercent(p.yieldFloor)}</td>
                  <td>{p.rules === "nelson" ? "Nelson 1–8" : "Western Electric 1–4"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Panel>
      {editor ? (
        <Panel title="New product" className="mt-6">
          <ProductForm product={null} customers={customers} readOnly={false} />
        </Panel>
      ) : null}
    </>
  );
}
