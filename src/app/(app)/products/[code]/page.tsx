import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { PageHeader, Panel } from "@/components/ui/page-header";
import { can } from "@/lib/permissions";
import { requireContext } from "@/server/auth/context";
import { listCustomers } from "@/server/db/queries/customers";
import { listLots } from "@/server/db/queries/lots";
import { findProduct } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { ProductForm } from "../product-form";
import { DeviceModelPanel } from "./device-model-panel";
import { SpcSection } from "./spc-section";

export async function generateMetadata({ params }: { params: Promise<{ code: string }> }): Promise<Metadata> {
  return { title: decodeURIComponent((await params).code) };
}

export default async function ProductPage({ params }: { params: Promise<{ code: string }> }) {
  const code = decodeURIComponent((await params).code);
  const context = await requireContext("data.read");
  const { product, customers, recent } = await withScope(context.scope, async (tx) => ({
    product: await findProduct(tx, code),
    customers: await listCustomers(tx, context.scope),
    recent: await listLots(tx, { product: code, page: 1, pageSize: 30, sort: "probedAt", order: "desc" }),
  }));
  if (!product) notFound();
  const recentLots = recent.lots.flatMap((l) => (l.medianConductanceS === null ? [] : [{ temperatureK: l.chuckTemperatureK, medianS: l.medianConductanceS }]));
  return (
    <>
      <PageHeader eyebrow={`Product · ${product.customerName ?? "internal"}`} title={`${product.code} — ${product.name}`} />
      <div className="mb-6">
        <SpcSection productCode={product.code} />
      </div>
      <Panel title="Device model and thermal window" className="mb-6">
        <DeviceModelPanel code={product.code} model={product.deviceModel} windowFactor={product.windowFactor} unit={product.displayUnit} editable={can(context.role, "devicemodels.edit")} recentLots={recentLots} />
      </Panel>
      <Panel title="Settings">
        <ProductForm product={product} customers={customers} readOnly={!can(context.role, "products.edit")} />
      </Panel>
    </>
  );
}
