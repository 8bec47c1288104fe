import { lotFiltersSchema } from "@/lib/schemas/lots";
import { listLots } from "@/server/db/queries/lots";
import { withScope } from "@/server/db/scope";
import { apiRoute } from "@/server/http/route";

export const GET = apiRoute({ permission: "reports.read" }, async ({ scope, url }) => {
  const filters = lotFiltersSchema.parse(Object.fromEntries(url.searchParams));
  return Response.json(await withScope(scope, (tx) => listLots(tx, filters)));
});
