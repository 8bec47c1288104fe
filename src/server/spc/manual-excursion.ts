import "server-only";
import type { CreateExcursion } from "@/lib/schemas/excursions";
import { getProduct } from "../db/queries/products";
import { type Scope, withScope } from "../db/scope";
import { AppError } from "../http/errors";
import { kickMailer } from "../mail/outbox";
import { openExcursion } from "./raise-excursion";

/** An excursion raised by hand (§6): a product, a title, optional lots of that product and a first comment. */
export async function raiseExcursionByHand(scope: Scope, input: CreateExcursion): Promise<{ id: string; number: number }> {
  const created = await withScope(scope, async (tx) => {
    const product = await getProduct(tx, input.product);
    const lots = input.lots.length
      ? await tx.selectFrom("lots").select(["id", "lot_number"]).where("product_id", "=", product.id).where("lot_number", "in", input.lots).execute()
      : [];
    const missing = input.lots.filter((l) => !lots.some((r) => r.lot_number === l));
    if (missing.length) throw new AppError("unprocessable", `Not lots of ${product.code}: ${missing.join(", ")}`, missing.map((l) => ({ path: "lots", message: `${l}: no such lot` })));
    const opened = await openExcursion(tx, scope, {
      productId: product.id, productCode: product.code, trigger: "manual", title: input.title, limitSetId: null,
      evidence: { note: input.note ?? null },
      lots: lots.map((l) => ({ lotId: l.id, lotNumber: l.lot_number, wafers: [], findings: [] })),
    });
    if (input.note) {
      await tx.insertInto("excursion_comments").values({ tenant_id: scope.tenantId, excursion_id: opened.id, author_user_id: scope.userId, author_label: scope.actorLabel, body: input.note }).execute();
    }
    return opened;
  });
  kickMailer();
  return created;
}
