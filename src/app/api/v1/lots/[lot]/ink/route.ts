import { inkSchema } from "@/lib/schemas/dispositions";
import { inkDies } from "@/server/db/queries/dispositions";
import { withScope } from "@/server/db/scope";
import { readJson } from "@/server/http/body";
import { apiRoute } from "@/server/http/route";

/** `{wafer, dies: [[x, y], …], inked}`: inked dies count as fails in the shipped yield. */
export const POST = apiRoute({ permission: "dies.ink" }, async ({ request, scope, params }) => {
  const input = inkSchema.parse(await readJson(request));
  return Response.json(await withScope(scope, (tx) => inkDies(tx, scope, params.lot!, input)));
});
