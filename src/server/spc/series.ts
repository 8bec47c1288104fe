import "server-only";
import { type Kysely, sql } from "kysely";
import type { Database } from "../db/schema";
import type { SeriesLot } from "./chart-judgement";

/** Bins whose G is a measurement of the device (gross fails excluded), as lot-aggregates.ts takes wafer medians. */
export { PARAMETRIC_BINS } from "@/domain/yield/lot-analysis";

export interface SeriesWindow {
  productId: string;
  /** Lots probed at or after this instant… */
  from: Date;
  /** …and before this one (the next version's freeze), or open-ended. */
  until: Date | null;
  /** Stop at this lot (inclusive): the rules only look back, so later lots cannot change its hits. */
  upTo?: { probedAt: Date; lotNumber: string };
  /** Keep only the latest lots (for charts); rules are then run on what is kept. */
  latest?: number;
}

/** The lots of a product in a probe-time window, in probing order (then lot number), each with its wafers by slot. */
export async function loadSeries(tx: Kysely<Database>, window: SeriesWindow): Promise<SeriesLot[]> {
  let lots = tx
    .selectFrom("lots")
    .select(["id", "lot_number", "probed_at"])
    .where("product_id", "=", window.productId)
    .where("probed_at", ">=", window.from);
  if (window.until) lots = lots.where("probed_at", "<", window.until);
  if (window.upTo) lots = lots.where(sql<boolean>`(probed_at, lot_number) <= (${window.upTo.probedAt}::timestamptz, ${window.upTo.lotNumber})`);
  const rows = window.latest
    ? (await lots.orderBy("probed_at", "desc").orderBy("lot_number", "desc").limit(window.latest).execute()).reverse()
    : await lots.orderBy("probed_at").orderBy("lot_number").execute();
  if (rows.length === 0) return [];
  const wafers = await tx
    .selectFrom("wafers")
    .select(["lot_id", "slot", "median_conductance_s", "tested", "pass"])
    .where("lot_id", "in", rows.map((r) => r.id))
    .orderBy("slot")
    .execute();
  const byLot = new Map<string, SeriesLot>(rows.map((r) => [r.id, { lotNumber: r.lot_number, probedAt: r.probed_at.toISOString(), wafers: [] }]));
  for (const w of wafers) {
    byLot.get(w.lot_id)!.wafers.push({ slot: w.slot, medianConductanceS: w.median_conductance_s, yieldFraction: w.tested > 0 ? w.pass / w.tested : null });
  }
  return rows.map((r) => byLot.get(r.id)!);
}
