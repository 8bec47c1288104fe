"use server";

import { cookies } from "next/headers";
import { z } from "zod";
import { switchTenantSchema } from "@/lib/schemas/auth";
import { blankSessionCookie, invalidateSession } from "@/server/auth/session";
import { withGlobal } from "@/server/db/scope";
import { AppError } from "@/server/http/errors";
import { appAction } from "@/server/http/action";

export const switchTenantAction = appAction(switchTenantSchema, { permission: "tenant.read" }, async ({ tenantId }, { context }) => {
  if (!context.sessionId || !context.memberships.some((m) => m.tenantId === tenantId)) throw new AppError("not_found", "Tenant not found");
  await withGlobal((tx) => tx.updateTable("user_sessions").set({ active_tenant_id: tenantId }).where("id", "=", context.sessionId!).execute());
  return { tenantId };
});

export const signOutAction = appAction(z.object({}), { permission: "tenant.read" }, async (_input, { context }) => {
  if (context.sessionId) await invalidateSession(context.sessionId);
  const blank = blankSessionCookie();
  (await cookies()).set(blank.name, blank.value, blank.attributes);
  return { next: "/sign-in" };
});
