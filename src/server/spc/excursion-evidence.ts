import "server-only";
import type { Kysely } from "kysely";
import { limitSetInForce } from "../db/queries/limit-sets";
import type { ConductanceUnit } from "@/lib/format";
import type { Database } from "../db/schema";
import { chartsUnder, type ProductCharts } from "./product-charts";

/**
 * The chart an excursion is judged on: the product's charts under the excursion's limit version (or the one in
 * force when its last lot was probed), ending at that lot. Null when no version applies.
 */
export async function getExcursionEvidence(tx: Kysely<Database>, excursionId: string): Promise<ProductCharts | null> {
  const e = await tx
    .selectFrom("excursions as e")
    .innerJoin("products as p", (j) => j.onRef("p.tenant_id", "=", "e.tenant_id").onRef("p.id", "=", "e.product_id"))
    .select(["e.limit_set_id", "p.id", "p.yield_floor", "p.spec_low_s", "p.spec_high_s", "p.display_unit"])
    .where("e.id", "=", excursionId)
    .executeTakeFirst();
  if (!e) return null;
  const last = await tx
    .selectFrom("excursion_lots as el")
    .innerJoin("lots as l", (j) => j.onRef("l.tenant_id", "=", "el.tenant_id").onRef("l.id", "=", "el.lot_id"))
    .select(["l.lot_number", "l.probed_at"])
    .where("el.excursion_id", "=", excursionId)
    .orderBy("l.probed_at", "desc")
    .orderBy("l.lot_number", "desc")
    .limit(1)
    .executeTakeFirst();
  const limitSet = e.limit_set_id
    ? await tx.selectFrom("limit_sets").selectAll().where("id", "=", e.limit_set_id).executeTakeFirst()
    : last
      ? await limitSetInForce(tx, e.id, last.probed_at)
      : null;
  if (!limitSet) return null;
  const product = { id: e.id, yieldFloor: e.yield_floor, specLowS: e.spec_low_s, specHighS: e.spec_high_s, displayUnit: e.display_unit as ConductanceUnit };
  return chartsUnder(tx, product, limitSet, last ? { probedAt: last.probed_at, lotNumber: last.lot_number } : undefined);
}
