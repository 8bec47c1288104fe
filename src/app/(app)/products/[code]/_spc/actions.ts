"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { limitFormSchema } from "@/lib/schemas/limits";
import { freezeLimitSet } from "@/server/db/queries/limit-sets";
import { getProduct } from "@/server/db/queries/products";
import { setWatching } from "@/server/db/queries/watchers";
import { withScope } from "@/server/db/scope";
import { appAction } from "@/server/http/action";
import { computeLimits } from "@/server/spc/limit-computation";

export const previewLimitsAction = appAction(limitFormSchema, { permission: "limits.freeze" }, async ({ productCode, baseline }, { scope }) =>
  withScope(scope, async (tx) => {
    const { lotIds: _ids, ...computed } = await computeLimits(tx, await getProduct(tx, productCode), baseline);
    return computed;
  }),
);

export const freezeLimitsAction = appAction(limitFormSchema, { permission: "limits.freeze" }, async ({ productCode, baseline }, { scope }) => {
  const frozen = await withScope(scope, async (tx) => freezeLimitSet(tx, scope, await getProduct(tx, productCode), baseline));
  revalidatePath(`/products/${encodeURIComponent(productCode)}`);
  return { version: frozen.version };
});

const watchSchema = z.object({ productCode: z.string().trim().min(1).max(40), watching: z.union([z.boolean(), z.enum(["true", "false"]).transform((v) => v === "true")]) });

export const setWatchingAction = appAction(watchSchema, { permission: "products.edit" }, async ({ productCode, watching }, { scope }) => {
  await withScope(scope, async (tx) => setWatching(tx, scope, await getProduct(tx, productCode), watching));
  revalidatePath(`/products/${encodeURIComponent(productCode)}`);
  return { watching };
});
