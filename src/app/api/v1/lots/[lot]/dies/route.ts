import { dieColumns, dieCsv } from "@/lib/die-csv";
import { dieFiltersSchema } from "@/lib/schemas/lots";
import { listDies } from "@/server/db/queries/dies";
import { findLotId } from "@/server/db/queries/lots";
import { withScope } from "@/server/db/scope";
import { apiRoute } from "@/server/http/route";

export const GET = apiRoute({ permission: "data.read" }, async ({ scope, params, url }) => {
  const filters = dieFiltersSchema.parse(Object.fromEntries(url.searchParams));
  const dies = await withScope(scope, async (tx) => listDies(tx, await findLotId(tx, params.lot!), filters));
  const columns = dieColumns(filters.fields);
  if (filters.format === "csv") {
    return new Response(dieCsv(dies, columns), {
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${params.lot}-dies.csv"` },
    });
  }
  return Response.json({ lot: params.lot, count: dies.length, dies: filters.fields ? dies.map((d) => Object.fromEntries(columns.map((c) => [c, d[c]]))) : dies });
});
