import type { Metadata } from "next";
import { PageHeader } from "@/components/ui/page-header";
import { requireContext } from "@/server/auth/context";
import { listProducts } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { LotTable } from "./lot-table";

export const metadata: Metadata = { title: "Lots" };

export default async function LotsPage() {
  const context = await requireContext("data.read");
  const products = await withScope(context.scope, listProducts);
  return (
    <>
      <PageHeader eyebrow={context.tenantName} title="Lots" />
      <LotTable products={products.map((p) => ({ code: p.code, unit: p.displayUnit }))} />
    </>
  );
}
