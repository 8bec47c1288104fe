import "server-only";
import type { Kysely } from "kysely";
import type { ControlChartInput } from "@/components/charts/control-chart-options";
import { type BaselineLimitValues, individualsChart } from "@/domain/spc";
import { type ConductanceUnit, conductanceIn, UNIT_LABEL } from "@/lib/format";
import type { Database } from "../db/schema";
import { limitSetInForce, type LimitSetRow, supersededAt } from "../db/queries/limit-sets";
import { judgeSeries, type MetricJudgement, type RuleHit } from "./chart-judgement";
import { type CapabilityResult, dieCapability } from "./die-capability";
import { loadSeries } from "./series";

const CHART_LOTS = 40;
const label = (hits: RuleHit[]) => hits.map((h) => `${h.rule}: ${h.description}`);

export interface ProductCharts {
  version: number;
  /** The unit the G charts print, the product's display unit: "µS", "S" or "G₀". */
  conductanceUnit: string;
  lotCount: number;
  medianG: ControlChartInput;
  movingRange: ControlChartInput;
  lotMeanG: ControlChartInput | null;
  yieldChart: ControlChartInput;
  notes: string[];
  capability: CapabilityResult;
}

function individualsInput(m: MetricJudgement, scale: number, unitLabel: string, yieldFloor?: number | null): ControlChartInput {
  const ind = m.individuals;
  return {
    points: ind.points.map((p) => ({ label: `${p.lotNumber} · W${p.wafer}`, value: p.value * scale, violations: label(p.hits) })),
    center: ind.center * scale, ucl: ind.ucl * scale, lcl: ind.lcl * scale, sigma: ind.sigma * scale, unitLabel,
    yieldFloor: yieldFloor === undefined || yieldFloor === null ? undefined : yieldFloor * scale,
  };
}

/**
 * The product page's charts (§6) under the version in force now: individuals of wafer median G with its moving
 * range, the lot X̄ chart (limits for the baseline's usual lot size), wafer yield against the yield floor, and
 * die-level capability over the charted lots. Null before the first freeze.
 */
export async function getProductCharts(tx: Kysely<Database>, product: ChartProduct): Promise<ProductCharts | null> {
  const limitSet = await limitSetInForce(tx, product.id, new Date());
  return limitSet ? chartsUnder(tx, product, limitSet) : null;
}

type ChartProduct = { id: string; yieldFloor: number | null; specLowS: number | null; specHighS: number | null; displayUnit: ConductanceUnit };

/** The same charts under a given version, optionally ending at one lot (an excursion's evidence). */
export async function chartsUnder(tx: Kysely<Database>, product: ChartProduct, limitSet: LimitSetRow, upTo?: { probedAt: Date; lotNumber: string }): Promise<ProductCharts> {
  const series = await loadSeries(tx, { productId: product.id, from: limitSet.in_force_from, until: await supersededAt(tx, limitSet), upTo, latest: CHART_LOTS });
  const limits = limitSet.limits as BaselineLimitValues;
  const judged = judgeSeries(series, limits, limitSet.rules);
  const g = judged.waferMedianConductanceS;
  const notes = [
    g.individuals.skipped && `Wafer median G: ${g.individuals.skipped}.`,
    judged.waferYieldFraction.individuals.skipped && `Wafer yield: ${judged.waferYieldFraction.individuals.skipped}.`,
  ].filter((n): n is string => Boolean(n));
  if (series.length === CHART_LOTS) notes.push(`Showing the latest ${CHART_LOTS} lots; runs are counted from the first of them.`);
  // G is charted in the product's own unit (VD-NW40 in G₀, AA-TF220 in µS), as everywhere else it is shown.
  const scale = conductanceIn(1, product.displayUnit);
  const unitLabel = UNIT_LABEL[product.displayUnit];
  const values = g.individuals.points.map((p) => p.value);
  const ind = limits.waferMedianConductanceS.individuals;
  const movingRange: ControlChartInput = {
    points: values.length >= 2 ? individualsChart(values).movingRanges.map((mr, i) => ({ label: g.individuals.points[i + 1]!.lotNumber, value: mr * scale, violations: mr > ind.mrUcl ? ["Moving range beyond its upper limit."] : [] })) : [],
    center: ind.mrBar * scale, ucl: ind.mrUcl * scale, lcl: ind.mrLcl * scale, sigma: 0, unitLabel,
  };
  const frozenLot = limits.waferMedianConductanceS.lotXbarS;
  const lotMeanG: ControlChartInput | null = g.lotMeans && frozenLot
    ? {
        points: g.lotMeans.points.map((p) => ({ label: p.lotNumber, value: p.mean * scale, violations: label(p.hits) })),
        center: frozenLot.center * scale, ucl: frozenLot.ucl * scale, lcl: frozenLot.lcl * scale, sigma: frozenLot.sigma * scale, unitLabel,
      }
    : null;
  return {
    version: limitSet.version,
    conductanceUnit: unitLabel,
    lotCount: series.length,
    medianG: individualsInput(g, scale, unitLabel),
    movingRange,
    lotMeanG,
    yieldChart: individualsInput(judged.waferYieldFraction, 100, "%", product.yieldFloor),
    notes,
    capability: await dieCapabilityForSeries(tx, product, series.map((s) => s.lotNumber)),
  };
}

async function dieCapabilityForSeries(tx: Kysely<Database>, product: { id: string; specLowS: number | null; specHighS: number | null }, lotNumbers: string[]): Promise<CapabilityResult> {
  if (lotNumbers.length === 0) return { capability: null, reason: "no lots probed under this version yet" };
  const ids = await tx.selectFrom("lots").select("id").where("product_id", "=", product.id).where("lot_number", "in", lotNumbers).execute();
  return dieCapability(tx, ids.map((r) => r.id), product);
}
