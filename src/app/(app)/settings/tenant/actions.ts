"use server";

import { revalidatePath } from "next/cache";
import { tenantSettingsSchema } from "@/lib/schemas/tenant";
import { recordAudit } from "@/server/db/queries/audit";
import { withScope } from "@/server/db/scope";
import { appAction } from "@/server/http/action";

export const saveTenantSettingsAction = appAction(tenantSettingsSchema, { permission: "tenant.settings" }, async ({ name, errorBudgetPercent }, { scope }) => {
  await withScope(scope, async (tx) => {
    await tx.updateTable("tenants").set({ name, error_budget_fraction: errorBudgetPercent / 100 }).where("id", "=", scope.tenantId).execute();
    await recordAudit(tx, scope, "tenant.settings_changed", { type: "tenant", id: scope.tenantId }, { name, errorBudgetPercent });
  });
  revalidatePath("/", "layout");
  return { name };
});
