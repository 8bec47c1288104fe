import { individualsChart, xbarSChart, xbarSLimits } from "./charts";

/** One baseline wafer's statistics: median die conductance (S) and yield as a 0–1 fraction. */
export interface BaselineWafer {
  readonly medianConductanceS: number;
  readonly yieldFraction: number;
}

/** Frozen individuals/moving-range limits, in the metric's units. */
export interface FrozenIndividualsLimits {
  readonly center: number;
  readonly sigma: number;
  readonly ucl: number;
  readonly lcl: number;
  readonly mrBar: number;
  readonly mrUcl: number;
  readonly mrLcl: number;
  /** Wafers that entered the chart. */
  readonly count: number;
}

/** Frozen lot-level X̄–S values; a lot of n wafers is later judged by xbarSLimits(center, sBar, n). */
export interface FrozenXbarSLimits {
  readonly center: number;
  readonly sBar: number;
  readonly withinSigma: number;
  readonly subgroupCount: number;
  /** The most frequent lot size in the baseline (the larger on a tie); the limits below are for it. */
  readonly nominalSize: number;
  readonly sigma: number;
  readonly ucl: number;
  readonly lcl: number;
  readonly sUcl: number;
  readonly sLcl: number;
}

export interface FrozenMetricLimits {
  readonly individuals: FrozenIndividualsLimits;
  /** Null when no baseline lot has 2 or more usable wafers. */
  readonly lotXbarS: FrozenXbarSLimits | null;
}

export interface BaselineLimitValues {
  readonly waferMedianConductanceS: FrozenMetricLimits;
  readonly waferYieldFraction: FrozenMetricLimits;
}

/** Values to freeze for wafer median G (S) and wafer yield (0–1): individuals chart over every wafer in the order given (lots in probing order, wafers by slot), X̄–S with each lot as a subgroup (§6); wafers with a non-finite value are left out of that metric, lots with fewer than 2 usable wafers out of its X̄–S; RangeError below 2 usable wafers or for a yield outside [0, 1]. */
export function limitSetFromBaseline(lots: readonly (readonly BaselineWafer[])[]): BaselineLimitValues {
  for (const wafer of lots.flat()) {
    if (wafer.yieldFraction < 0 || wafer.yieldFraction > 1) {
      throw new RangeError(`wafer yield must be a fraction in [0, 1], got ${wafer.yieldFraction}`);
    }
  }
  return {
    waferMedianConductanceS: metricLimits(lots.map((wafers) => wafers.map((wafer) => wafer.medianConductanceS))),
    waferYieldFraction: metricLimits(lots.map((wafers) => wafers.map((wafer) => wafer.yieldFraction))),
  };
}

function metricLimits(lots: readonly (readonly number[])[]): FrozenMetricLimits {
  const usableLots = lots.map((values) => values.filter(Number.isFinite));
  const wafers = usableLots.flat();
  if (wafers.length < 2) throw new RangeError(`a baseline needs at least 2 usable wafers, got ${wafers.length}`);
  const { center, sigma, ucl, lcl, mrBar, mrUcl, mrLcl } = individualsChart(wafers);
  const subgroups = usableLots.filter((values) => values.length >= 2);
  return {
    individuals: { center, sigma, ucl, lcl, mrBar, mrUcl, mrLcl, count: wafers.length },
    lotXbarS: subgroups.length === 0 ? null : frozenXbarS(subgroups),
  };
}

function frozenXbarS(subgroups: readonly (readonly number[])[]): FrozenXbarSLimits {
  const chart = xbarSChart(subgroups);
  const nominalSize = mostFrequentSize(subgroups);
  return {
    center: chart.center,
    sBar: chart.sBar,
    withinSigma: chart.withinSigma,
    subgroupCount: subgroups.length,
    nominalSize,
    ...xbarSLimits(chart.center, chart.sBar, nominalSize),
  };
}

function mostFrequentSize(subgroups: readonly (readonly number[])[]): number {
  const counts = new Map<number, number>();
  for (const subgroup of subgroups) counts.set(subgroup.length, (counts.get(subgroup.length) ?? 0) + 1);
  let best = 0;
  let bestCount = 0;
  for (const [size, count] of counts) {
    if (count > bestCount || (count === bestCount && size > best)) {
      best = size;
      bestCount = count;
    }
  }
  return best;
}
