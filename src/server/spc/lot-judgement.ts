import "server-only";
import type { Kysely } from "kysely";
import type { BaselineLimitValues } from "@/domain/spc";
import { limitSetInForce, supersededAt } from "../db/queries/limit-sets";
import type { Database } from "../db/schema";
import { AppError } from "../http/errors";
import { judgeSeries, METRIC_LABELS, METRICS } from "./chart-judgement";
import { type CapabilityResult, dieCapability } from "./die-capability";
import { type EdgeCheck, edgeChecks } from "./edge-ring";
import { loadSeries } from "./series";

export interface LotRuleHit {
  /** e.g. "Individuals · wafer median G" or "Lot X̄ · wafer yield". */
  chart: string;
  metric: "waferMedianConductanceS" | "waferYieldFraction";
  kind: "individuals" | "lotMean";
  wafer: number | null;
  rule: string;
  description: string;
  value: number;
}

export interface LotJudgement {
  lotId: string;
  lot: string;
  product: string;
  productId: string;
  probedAt: string;
  rules: "western-electric" | "nelson";
  /** The version in force when the lot was probed; null when the lot was probed before any freeze. */
  limitSet: { id: string; version: number; frozenAt: string; frozenBy: string } | null;
  hits: LotRuleHit[];
  /** Why a chart was not judged (no limits in force, no spread in the baseline). */
  notes: string[];
  yieldFloor: { floor: number | null; lotYield: number | null; broken: boolean };
  edge: EdgeCheck[];
  capability: CapabilityResult;
}

/**
 * Judges one lot (§6): the run rules on the product's individuals and lot X̄–S charts, over the lots probed under
 * the same limit version up to this one; its yield against the floor; each wafer's edge against its centre; and
 * die-level capability against the spec window.
 */
export async function getLotJudgement(tx: Kysely<Database>, lotId: string): Promise<LotJudgement> {
  const lot = await tx
    .selectFrom("lots as l")
    .innerJoin("products as p", (j) => j.onRef("p.tenant_id", "=", "l.tenant_id").onRef("p.id", "=", "l.product_id"))
    .select([
      "l.id", "l.lot_number", "l.probed_at", "l.tested", "l.pass", "p.id as product_id", "p.code", "p.rules", "p.yield_floor", "p.spec_low_s", "p.spec_high_s",
      "p.die_width_mm", "p.die_height_mm", "p.wafer_diameter_mm", "p.edge_exclusion_mm",
    ])
    .where("l.id", "=", lotId)
    .executeTakeFirst();
  if (!lot) throw new AppError("not_found", "Lot not found");
  const notes: string[] = [];
  const hits: LotRuleHit[] = [];
  const limitSet = await limitSetInForce(tx, lot.product_id, lot.probed_at);
  if (!limitSet) notes.push("No control limits were in force when this lot was probed.");
  else {
    const series = await loadSeries(tx, {
      productId: lot.product_id, from: limitSet.in_force_from, until: await supersededAt(tx, limitSet), upTo: { probedAt: lot.probed_at, lotNumber: lot.lot_number },
    });
    const judged = judgeSeries(series, limitSet.limits as BaselineLimitValues, limitSet.rules);
    for (const metric of METRICS) {
      const m = judged[metric];
      const label = METRIC_LABELS[metric];
      if (m.individuals.skipped) notes.push(`Individuals · ${label}: ${m.individuals.skipped}.`);
      for (const p of m.individuals.points) {
        if (p.lotNumber !== lot.lot_number) continue;
        for (const h of p.hits) hits.push({ chart: `Individuals · ${label}`, metric, kind: "individuals", wafer: p.wafer, rule: h.rule, description: h.description, value: p.value });
      }
      if (m.lotMeans?.skipped) notes.push(`Lot X̄ · ${label}: ${m.lotMeans.skipped}.`);
      for (const p of m.lotMeans?.points ?? []) {
        if (p.lotNumber !== lot.lot_number) continue;
        for (const h of p.hits) hits.push({ chart: `Lot X̄–S · ${label}`, metric, kind: "lotMean", wafer: null, rule: h.rule, description: h.description, value: p.mean });
      }
    }
  }
  const lotYield = lot.tested > 0 ? lot.pass / lot.tested : null;
  return {
    lotId: lot.id,
    lot: lot.lot_number,
    product: lot.code,
    productId: lot.product_id,
    probedAt: lot.probed_at.toISOString(),
    rules: lot.rules,
    limitSet: limitSet && { id: limitSet.id, version: limitSet.version, frozenAt: limitSet.frozen_at.toISOString(), frozenBy: limitSet.frozen_by_label },
    hits,
    notes,
    yieldFloor: { floor: lot.yield_floor, lotYield, broken: lot.yield_floor !== null && lotYield !== null && lotYield < lot.yield_floor },
    edge: await edgeChecks(tx, lot.id, {
      dieWidthMm: lot.die_width_mm, dieHeightMm: lot.die_height_mm, waferDiameterMm: lot.wafer_diameter_mm, edgeExclusionMm: lot.edge_exclusion_mm,
    }),
    capability: await dieCapability(tx, [lot.id], { specLowS: lot.spec_low_s, specHighS: lot.spec_high_s }),
  };
}
