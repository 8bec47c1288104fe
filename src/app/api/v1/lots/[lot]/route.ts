import { getLotDetail } from "@/server/db/queries/lots";
import { withScope } from "@/server/db/scope";
import { apiRoute } from "@/server/http/route";

export const GET = apiRoute({ permission: "reports.read" }, async ({ scope, params }) => {
  const { id: _id, ...lot } = await withScope(scope, (tx) => getLotDetail(tx, params.lot!));
  return Response.json(lot);
});
