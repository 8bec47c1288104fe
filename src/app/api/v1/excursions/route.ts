import { excursionFiltersSchema } from "@/lib/schemas/excursions";
import { listExcursions } from "@/server/db/queries/excursions";
import { withScope } from "@/server/db/scope";
import { apiRoute } from "@/server/http/route";

export const GET = apiRoute({ permission: "data.read" }, async ({ scope, url }) => {
  const filters = excursionFiltersSchema.parse(Object.fromEntries(url.searchParams));
  return Response.json({ excursions: await withScope(scope, (tx) => listExcursions(tx, filters)) });
});
