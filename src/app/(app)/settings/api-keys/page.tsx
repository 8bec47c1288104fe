import type { Metadata } from "next";
import { PageHeader, Panel } from "@/components/ui/page-header";
import { requireContext } from "@/server/auth/context";
import { listApiKeys } from "@/server/db/queries/api-keys";
import { listCustomers } from "@/server/db/queries/customers";
import { withScope } from "@/server/db/scope";
import { ApiKeyList, CreateKeyForm } from "./api-key-forms";

export const metadata: Metadata = { title: "API keys" };

export default async function ApiKeysPage() {
  const context = await requireContext("apikeys.manage");
  const { keys, customers } = await withScope(context.scope, async (tx) => ({ keys: await listApiKeys(tx), customers: await listCustomers(tx, context.scope) }));
  return (
    <>
      <PageHeader eyebrow="Settings" title="API keys" />
      <p className="mb-6 max-w-3xl text-sm text-ink-soft">
        Probe stations and scripts call the API with <code className="rounded bg-slate-wash px-1">Authorization: Bearer &lt;key&gt;</code>. A key acts
        in this tenant with the role it was given. Its secret is shown once, when it is made; Lotwarden keeps only a hash.
      </p>
      <div className="grid gap-6 xl:grid-cols-[1fr_360px]">
        <Panel title="Keys">
          <ApiKeyList keys={keys} />
        </Panel>
        <Panel title="New key">
          <CreateKeyForm customers={customers} />
        </Panel>
      </div>
    </>
  );
}
