"use server";

import { revalidatePath } from "next/cache";
import { apiKeyIdSchema, createApiKeySchema } from "@/lib/schemas/members";
import { createApiKey, revokeApiKey } from "@/server/db/queries/api-keys";
import { withScope } from "@/server/db/scope";
import { appAction } from "@/server/http/action";

export const createApiKeyAction = appAction(createApiKeySchema, { permission: "apikeys.manage" }, async (input, { scope }) => {
  const created = await withScope(scope, (tx) => createApiKey(tx, scope, input));
  revalidatePath("/settings/api-keys");
  return created;
});

export const revokeApiKeyAction = appAction(apiKeyIdSchema, { permission: "apikeys.manage" }, async ({ keyId }, { scope }) => {
  await withScope(scope, (tx) => revokeApiKey(tx, scope, keyId));
  revalidatePath("/settings/api-keys");
  return { keyId };
});
