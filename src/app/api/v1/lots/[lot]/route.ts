import { getLotDetail } from "@/server/db/queries/lots";
import { withScope } from "@/server/db/scope";
import { apiRoute } from "@/server/http/route";

export const GET = apiRoute({ permission: "reports.read" }, async ({ scope, params }) => {
  const { id: _id, ...lot } = await withScope(scope, (tx) => getLotDetail(tx, params.lot!));
  if (scope.customerId) {
    // A customer sees yields and bins, not the fab's internal die windows or excursions (§2).
    const { openExcursions: _e, outOfWindow: _o, ...visible } = lot;
    return Response.json({ ...visible, wafers: lot.wafers.map(({ windowLowS: _l, windowHighS: _h, outOfWindow: _w, ...w }) => w) });
  }
  return Response.json(lot);
});
