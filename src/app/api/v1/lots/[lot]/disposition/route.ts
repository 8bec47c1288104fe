import { dispositionSchema } from "@/lib/schemas/dispositions";
import { setDisposition } from "@/server/db/queries/dispositions";
import { withScope } from "@/server/db/scope";
import { readJson } from "@/server/http/body";
import { apiRoute } from "@/server/http/route";
import { kickMailer } from "@/server/mail/outbox";

/** `{action: hold|release|scrap, reason, overrideReason?}` (§9). */
export const POST = apiRoute({ permission: "lots.disposition" }, async ({ request, scope, params }) => {
  const input = dispositionSchema.parse(await readJson(request));
  const result = await withScope(scope, (tx) => setDisposition(tx, scope, params.lot!, input));
  if (result.notified > 0) kickMailer();
  return Response.json(result);
});
