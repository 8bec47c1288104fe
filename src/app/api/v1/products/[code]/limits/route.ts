import { limitBaselineSchema } from "@/lib/schemas/limits";
import { freezeLimitSet, listLimitSets } from "@/server/db/queries/limit-sets";
import { getProduct } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { readJson } from "@/server/http/body";
import { apiRoute } from "@/server/http/route";
import { computeLimits } from "@/server/spc/limit-computation";

export const GET = apiRoute({ permission: "data.read" }, async ({ scope, params }) => {
  const versions = await withScope(scope, async (tx) => listLimitSets(tx, (await getProduct(tx, params.code!)).id));
  return Response.json({ versions });
});

/** Computes limits from `{lots}` or `{from, to}` and freezes them as the next version; `preview: true` only computes. */
export const POST = apiRoute({ permission: "limits.freeze" }, async ({ request, scope, params }) => {
  const baseline = limitBaselineSchema.parse(await readJson(request));
  return withScope(scope, async (tx) => {
    const product = await getProduct(tx, params.code!);
    if (baseline.preview) {
      const { lotIds: _ids, ...computed } = await computeLimits(tx, product, baseline);
      return Response.json(computed);
    }
    return Response.json(await freezeLimitSet(tx, scope, product, baseline), { status: 201 });
  });
});
