import { DIE_CSV_COLUMNS, dieFiltersSchema, type DieRecord } from "@/lib/schemas/lots";
import { listDies } from "@/server/db/queries/dies";
import { findLotId } from "@/server/db/queries/lots";
import { withScope } from "@/server/db/scope";
import { apiRoute } from "@/server/http/route";

function csvCell(value: unknown): string {
  if (value === null || value === undefined) return "";
  const text = String(value);
  return /[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export const GET = apiRoute({ permission: "data.read" }, async ({ scope, params, url }) => {
  const filters = dieFiltersSchema.parse(Object.fromEntries(url.searchParams));
  const dies = await withScope(scope, async (tx) => listDies(tx, await findLotId(tx, params.lot!), filters));
  if (filters.format === "csv") {
    const lines = [DIE_CSV_COLUMNS.join(","), ...dies.map((d) => DIE_CSV_COLUMNS.map((c) => csvCell(d[c as keyof DieRecord])).join(","))];
    return new Response(lines.join("\n") + "\n", {
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${params.lot}-dies.csv"` },
    });
  }
  return Response.json({ lot: params.lot, count: dies.length, dies });
});
