import { patchProductSchema } from "@/lib/schemas/products";
import { getProduct, updateProduct } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { readJson } from "@/server/http/body";
import { apiRoute } from "@/server/http/route";

export const GET = apiRoute({ permission: "data.read" }, async ({ scope, params }) => {
  const { id: _id, ...product } = await withScope(scope, (tx) => getProduct(tx, params.code!));
  return Response.json(product);
});

export const PATCH = apiRoute({ permission: "products.edit" }, async ({ request, scope, params }) => {
  const input = patchProductSchema.parse(await readJson(request));
  return Response.json(await withScope(scope, (tx) => updateProduct(tx, scope, params.code!, input)));
});
