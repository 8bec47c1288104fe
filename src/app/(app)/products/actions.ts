"use server";

import { revalidatePath } from "next/cache";
import { productFormSchema } from "@/lib/schemas/product-form";
import { createProduct, updateProduct } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { appAction } from "@/server/http/action";

export const saveProductAction = appAction(productFormSchema, { permission: "products.edit" }, async (input, { scope }) => {
  const exists = await withScope(scope, async (tx) => Boolean(await tx.selectFrom("products").select("id").where("code", "=", input.code).executeTakeFirst()));
  const { code, ...fields } = input;
  const product = await withScope(scope, (tx) => (exists ? updateProduct(tx, scope, code, fields) : createProduct(tx, scope, input)));
  revalidatePath("/products");
  revalidatePath(`/products/${encodeURIComponent(code)}`);
  return { code: product.code, created: !exists };
});
