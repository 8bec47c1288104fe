import type { Metadata } from "next";
import { PageHeader, Panel } from "@/components/ui/page-header";
import { requireContext } from "@/server/auth/context";
import { listProducts } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { JobList } from "./job-list";
import { UploadZone } from "./upload-zone";

export const metadata: Metadata = { title: "Uploads" };

export default async function UploadsPage() {
  const context = await requireContext("lots.upload");
  const products = await withScope(context.scope, listProducts);
  return (
    <>
      <PageHeader eyebrow={context.tenantName} title="Uploads" />
      <div className="space-y-6">
        <Panel title="Drop probe lot files">
          <UploadZone products={products.map((p) => p.code)} />
        </Panel>
        <Panel title="Ingest jobs">
          <JobList />
        </Panel>
      </div>
    </>
  );
}
