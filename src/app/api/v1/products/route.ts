import { createProductSchema } from "@/lib/schemas/products";
import { createProduct, listProducts } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { readJson } from "@/server/http/body";
import { apiRoute } from "@/server/http/route";

export const GET = apiRoute({ permission: "data.read" }, async ({ scope }) => Response.json({ products: await withScope(scope, listProducts) }));

export const POST = apiRoute({ permission: "products.edit" }, async ({ request, scope }) => {
  const input = createProductSchema.parse(await readJson(request));
  return Response.json(await withScope(scope, (tx) => createProduct(tx, scope, input)), { status: 201 });
});
