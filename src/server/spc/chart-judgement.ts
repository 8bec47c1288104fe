// Pure: judges a sequence of lots against frozen limits with the product's run rules (§6). No I/O, so it is
// tested in milliseconds; the loaders in series.ts feed it.
import { type BaselineLimitValues, evaluateRules, type FrozenMetricLimits, type RuleSet, xbarSLimits } from "@/domain/spc";

export interface SeriesWafer {
  slot: number;
  medianConductanceS: number | null;
  yieldFraction: number | null;
}

export interface SeriesLot {
  lotNumber: string;
  probedAt: string;
  wafers: SeriesWafer[];
}

export type MetricKey = "waferMedianConductanceS" | "waferYieldFraction";
export const METRICS: readonly MetricKey[] = ["waferMedianConductanceS", "waferYieldFraction"];
export const METRIC_LABELS: Record<MetricKey, string> = { waferMedianConductanceS: "wafer median G", waferYieldFraction: "wafer yield" };

export interface RuleHit {
  rule: string;
  description: string;
}

export interface IndividualsPoint {
  lotNumber: string;
  wafer: number;
  value: number;
  hits: RuleHit[];
}

export interface LotMeanPoint {
  lotNumber: string;
  size: number;
  mean: number;
  s: number;
  ucl: number;
  lcl: number;
  sUcl: number;
  sLcl: number;
  hits: RuleHit[];
}

export interface MetricJudgement {
  metric: MetricKey;
  individuals: { center: number; sigma: number; ucl: number; lcl: number; points: IndividualsPoint[]; skipped: string | null };
  lotMeans: { center: number; sBar: number; points: LotMeanPoint[]; skipped: string | null } | null;
}

const S_CHART_HIT: RuleHit = { rule: "S", description: "Spread of the lot's wafers beyond the S chart's upper limit." };

function valueOf(wafer: SeriesWafer, metric: MetricKey): number | null {
  const v = metric === "waferMedianConductanceS" ? wafer.medianConductanceS : wafer.yieldFraction;
  return v !== null && Number.isFinite(v) ? v : null;
}

function meanAndSd(values: number[]): { mean: number; s: number } {
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  const s = Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / (values.length - 1));
  return { mean, s };
}

// Zero σ (a baseline with no spread, e.g. every wafer at 100 % yield) would flag any difference: rules are not run.
const usable = (sigma: number) => Number.isFinite(sigma) && sigma > 0;

function judgeMetric(lots: readonly SeriesLot[], limits: FrozenMetricLimits, metric: MetricKey, ruleSet: RuleSet): MetricJudgement {
  const ind = limits.individuals;
  const points: IndividualsPoint[] = lots.flatMap((lot) =>
    lot.wafers.flatMap((w) => {
      const value = valueOf(w, metric);
      return value === null ? [] : [{ lotNumber: lot.lotNumber, wafer: w.slot, value, hits: [] as RuleHit[] }];
    }),
  );
  const indSkipped = usable(ind.sigma) ? null : "the baseline had no spread (σ̂ = 0), so no rule is run";
  if (!indSkipped) {
    for (const v of evaluateRules(points.map((p) => p.value), ind.center, ind.sigma, ruleSet)) points[v.index]!.hits.push({ rule: v.rule, description: v.description });
  }
  const individuals = { center: ind.center, sigma: ind.sigma, ucl: ind.ucl, lcl: ind.lcl, points, skipped: indSkipped };
  const frozen = limits.lotXbarS;
  if (!frozen) return { metric, individuals, lotMeans: null };
  const meanPoints: (LotMeanPoint & { z: number })[] = lots.flatMap((lot) => {
    const values = lot.wafers.map((w) => valueOf(w, metric)).filter((v): v is number => v !== null);
    if (values.length < 2) return [];
    const { mean, s } = meanAndSd(values);
    const l = xbarSLimits(frozen.center, frozen.sBar, values.length);
    return [{ lotNumber: lot.lotNumber, size: values.length, mean, s, ucl: l.ucl, lcl: l.lcl, sUcl: l.sUcl, sLcl: l.sLcl, hits: [], z: (mean - frozen.center) / l.sigma }];
  });
  const meanSkipped = usable(frozen.sBar) ? null : "the baseline lots had no spread between wafers (s̄ = 0), so no rule is run";
  if (!meanSkipped) {
    // Subgroup sizes may differ, so the rules read z-scores against centre 0, σ 1 (see domain/spc/rules.ts).
    for (const v of evaluateRules(meanPoints.map((p) => p.z), 0, 1, ruleSet)) meanPoints[v.index]!.hits.push({ rule: v.rule, description: v.description });
    for (const p of meanPoints) if (p.s > p.sUcl) p.hits.push(S_CHART_HIT);
  }
  return { metric, individuals, lotMeans: { center: frozen.center, sBar: frozen.sBar, points: meanPoints.map(({ z: _z, ...p }) => p), skipped: meanSkipped } };
}

/** Both metrics' individuals and lot X̄–S charts over the lots in probing order, with the rule hits per point. */
export function judgeSeries(lots: readonly SeriesLot[], limits: BaselineLimitValues, ruleSet: RuleSet): Record<MetricKey, MetricJudgement> {
  return {
    waferMedianConductanceS: judgeMetric(lots, limits.waferMedianConductanceS, "waferMedianConductanceS", ruleSet),
    waferYieldFraction: judgeMetric(lots, limits.waferYieldFraction, "waferYieldFraction", ruleSet),
  };
}
