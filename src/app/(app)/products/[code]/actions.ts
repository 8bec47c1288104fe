"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { deviceModelSchema, productCodeSchema } from "@/lib/schemas/products";
import { updateProduct } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { appAction } from "@/server/http/action";

const saveSchema = z.object({ code: productCodeSchema, model: z.string().transform((s, ctx) => { try { return JSON.parse(s); } catch { ctx.addIssue({ code: "custom", message: "not JSON" }); return z.NEVER; } }).pipe(deviceModelSchema) });

export const saveDeviceModelAction = appAction(saveSchema, { permission: "devicemodels.edit" }, async ({ code, model }, { scope }) => {
  await withScope(scope, (tx) => updateProduct(tx, scope, code, { deviceModel: model }));
  revalidatePath(`/products/${encodeURIComponent(code)}`);
  return { code };
});

const targetSchema = z.object({ code: productCodeSchema, targetS: z.coerce.number().positive().finite(), tolerancePercent: z.coerce.number().min(0.1).max(50) });

/** Sets the spec window to the model's expected G ± tolerance (audited as a product change). */
export const setSpecFromModelAction = appAction(targetSchema, { permission: "products.edit" }, async ({ code, targetS, tolerancePercent }, { scope }) => {
  const specLowS = targetS * (1 - tolerancePercent / 100);
  const specHighS = targetS * (1 + tolerancePercent / 100);
  await withScope(scope, (tx) => updateProduct(tx, scope, code, { specLowS, specHighS }));
  revalidatePath(`/products/${encodeURIComponent(code)}`);
  return { specLowS, specHighS };
});
