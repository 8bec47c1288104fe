import { DIE_CSV_COLUMNS, type DieField, dieFiltersSchema, type DieRecord } from "@/lib/schemas/lots";
import { listDies } from "@/server/db/queries/dies";
import { findLotId } from "@/server/db/queries/lots";
import { withScope } from "@/server/db/scope";
import { apiRoute } from "@/server/http/route";

function csvCell(value: unknown): string {
  if (value === null || value === undefined) return "";
  const text = String(value);
  return /[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** wafer, x and y, then the asked-for fields, in the §9 order; every field without `fields`. */
function columnsFor(fields: readonly DieField[] | undefined): readonly DieField[] {
  return fields === undefined ? DIE_CSV_COLUMNS : DIE_CSV_COLUMNS.filter((c) => c === "wafer" || c === "x" || c === "y" || fields.includes(c));
}

export const GET = apiRoute({ permission: "data.read" }, async ({ scope, params, url }) => {
  const filters = dieFiltersSchema.parse(Object.fromEntries(url.searchParams));
  const dies = await withScope(scope, async (tx) => listDies(tx, await findLotId(tx, params.lot!), filters));
  const columns = columnsFor(filters.fields);
  if (filters.format === "csv") {
    const lines = [columns.join(","), ...dies.map((d) => columns.map((c) => csvCell(d[c])).join(","))];
    return new Response(lines.join("\n") + "\n", {
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${params.lot}-dies.csv"` },
    });
  }
  return Response.json({ lot: params.lot, count: dies.length, dies: filters.fields ? dies.map((d) => Object.fromEntries(columns.map((c) => [c, d[c]]))) : dies });
});
