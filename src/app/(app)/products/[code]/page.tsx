import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { PageHeader, Panel } from "@/components/ui/page-header";
import { can } from "@/lib/permissions";
import { requireContext } from "@/server/auth/context";
import { listCustomers } from "@/server/db/queries/customers";
import { findProduct } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { ProductForm } from "../product-form";

export async function generateMetadata({ params }: { params: Promise<{ code: string }> }): Promise<Metadata> {
  return { title: decodeURIComponent((await params).code) };
}

export default async function ProductPage({ params }: { params: Promise<{ code: string }> }) {
  const code = decodeURIComponent((await params).code);
  const context = await requireContext("data.read");
  const { product, customers } = await withScope(context.scope, async (tx) => ({ product: await findProduct(tx, code), customers: await listCustomers(tx, context.scope) }));
  if (!product) notFound();
  return (
    <>
      <PageHeader eyebrow={`Product · ${product.customerName ?? "internal"}`} title={`${product.code} — ${product.name}`} />
      <Panel title="Settings">
        <ProductForm product={product} customers={customers} readOnly={!can(context.role, "products.edit")} />
      </Panel>
    </>
  );
}
