import type { Metadata } from "next";
import { PageHeader, Panel } from "@/components/ui/page-header";
import { requireContext } from "@/server/auth/context";
import { withScope } from "@/server/db/scope";
import { TenantForm } from "./tenant-form";

export const metadata: Metadata = { title: "Tenant settings" };

export default async function TenantSettingsPage() {
  const context = await requireContext("tenant.settings");
  const tenant = await withScope(context.scope, (tx) => tx.selectFrom("tenants").select(["name", "error_budget_fraction"]).where("id", "=", context.tenantId).executeTakeFirstOrThrow());
  return (
    <>
      <PageHeader eyebrow="Settings" title="Tenant" />
      <Panel>
        <TenantForm name={tenant.name} errorBudgetPercent={Number((tenant.error_budget_fraction * 100).toPrecision(6))} />
      </Panel>
    </>
  );
}
