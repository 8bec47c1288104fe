import { c4, chartConstants } from "./constants";
import { assertFinite, mean, sampleStandardDeviation } from "./sample-stats";

// Chart limits in the units of the plotted statistic (S for wafer median G, a 0–1 fraction for yield).

/** Boundaries of the rule zones: centre ± 1σ, ± 2σ, ± 3σ. */
export interface ZoneBoundaries {
  readonly lower3: number;
  readonly lower2: number;
  readonly lower1: number;
  readonly upper1: number;
  readonly upper2: number;
  readonly upper3: number;
}

/** Zone boundaries centre ± 1σ, 2σ, 3σ read by the Western Electric and Nelson rules; σ = 0 collapses them onto the centre. */
export function zoneBoundaries(center: number, sigma: number): ZoneBoundaries {
  return {
    lower3: center - 3 * sigma,
    lower2: center - 2 * sigma,
    lower1: center - sigma,
    upper1: center + sigma,
    upper2: center + 2 * sigma,
    upper3: center + 3 * sigma,
  };
}

export interface IndividualsChart {
  readonly center: number;
  readonly sigma: number;
  readonly ucl: number;
  readonly lcl: number;
  readonly zones: ZoneBoundaries;
  /** |xᵢ − xᵢ₋₁| for i ≥ 1, so one shorter than the input. */
  readonly movingRanges: readonly number[];
  readonly mrBar: number;
  readonly mrUcl: number;
  readonly mrLcl: number;
}

/** Individuals/moving-range chart (Montgomery §6.4): centre x̄, MR̄ = mean|xᵢ − xᵢ₋₁|, σ̂ = MR̄/d₂(2), limits x̄ ± 3σ̂, MR chart D₃(2)·MR̄ = 0 to D₄(2)·MR̄; zero spread gives σ̂ = 0; RangeError below 2 values or on a non-finite value. */
export function individualsChart(values: readonly number[]): IndividualsChart {
  if (values.length < 2) throw new RangeError(`an individuals chart needs at least 2 values, got ${values.length}`);
  assertFinite(values, "chart values");
  const constants = chartConstants(2);
  const center = mean(values);
  const movingRanges = values.slice(1).map((value, i) => Math.abs(value - (values[i] ?? value)));
  const mrBar = mean(movingRanges);
  const sigma = mrBar / constants.d2;
  return {
    center,
    sigma,
    ucl: center + 3 * sigma,
    lcl: center - 3 * sigma,
    zones: zoneBoundaries(center, sigma),
    movingRanges,
    mrBar,
    mrUcl: constants.D4 * mrBar,
    mrLcl: constants.D3 * mrBar,
  };
}

/** Limits that depend on the subgroup size n. */
export interface XbarSLimits {
  /** σ of a subgroup mean, A₃(n)·s̄/3 = s̄/(c₄(n)√n). */
  readonly sigma: number;
  readonly ucl: number;
  readonly lcl: number;
  readonly sUcl: number;
  readonly sLcl: number;
}

/** X̄–S limits for a subgroup of size n (Montgomery §6.3): x̿ ± A₃(n)·s̄, S chart B₃(n)·s̄ to B₄(n)·s̄ around s̄; RangeError unless n is an integer ≥ 2. */
export function xbarSLimits(center: number, sBar: number, n: number): XbarSLimits {
  const { A3, B3, B4 } = chartConstants(n);
  return { sigma: (A3 * sBar) / 3, ucl: center + A3 * sBar, lcl: center - A3 * sBar, sUcl: B4 * sBar, sLcl: B3 * sBar };
}

export interface XbarSPoint extends XbarSLimits {
  readonly size: number;
  readonly mean: number;
  readonly s: number;
  /** (x̄ᵢ − x̿)/σᵢ: run the rules on these with centre 0, σ 1 when subgroup sizes vary. */
  readonly zScore: number;
  readonly zones: ZoneBoundaries;
}

export interface XbarSChart {
  /** x̿, the grand mean weighted by subgroup size. */
  readonly center: number;
  readonly sBar: number;
  /** σ̂ of single values: s̄/c₄(n), or for pooled s̄ the pooled sd over c₄(ν + 1), ν = Σ(nᵢ − 1). */
  readonly withinSigma: number;
  /** True when sizes differ and s̄ is the pooled sd rather than the mean of the sᵢ. */
  readonly pooled: boolean;
  readonly points: readonly XbarSPoint[];
}

/** X̄–S chart (Montgomery §6.3): x̿ = Σnᵢx̄ᵢ/Σnᵢ; equal sizes s̄ = mean sᵢ, unequal sizes s̄ = √(Σ(nᵢ − 1)sᵢ²/Σ(nᵢ − 1)) (the textbook variable-n approach) with per-subgroup limits x̿ ± A₃(nᵢ)·s̄ and B₃(nᵢ)·s̄, B₄(nᵢ)·s̄; s̄ = 0 gives collapsed limits and infinite or NaN z-scores; RangeError for no subgroups, a subgroup below 2 values or a non-finite value. */
export function xbarSChart(subgroups: readonly (readonly number[])[]): XbarSChart {
  if (subgroups.length === 0) throw new RangeError("an X̄–S chart needs at least one subgroup");
  for (const subgroup of subgroups) {
    if (subgroup.length < 2) throw new RangeError(`every X̄–S subgroup needs at least 2 values, got ${subgroup.length}`);
    assertFinite(subgroup, "chart values");
  }
  return xbarSChartFromStats(subgroups.map((subgroup) => ({ size: subgroup.length, mean: mean(subgroup), s: sampleStandardDeviation(subgroup) })));
}

/** A subgroup reduced to its size, mean and sample sd (n − 1 divisor), e.g. as a database aggregate returns it. */
export interface SubgroupStats {
  readonly size: number;
  readonly mean: number;
  readonly s: number;
}

/** The X̄–S chart of `xbarSChart` from each subgroup's size, mean and sd instead of its values (same formulas); RangeError for no subgroups, a size that is not an integer ≥ 2, or a non-finite mean or sd. */
export function xbarSChartFromStats(stats: readonly SubgroupStats[]): XbarSChart {
  if (stats.length === 0) throw new RangeError("an X̄–S chart needs at least one subgroup");
  for (const stat of stats) {
    if (!Number.isInteger(stat.size) || stat.size < 2) throw new RangeError(`every X̄–S subgroup needs at least 2 values, got ${stat.size}`);
    if (!Number.isFinite(stat.mean) || !Number.isFinite(stat.s) || stat.s < 0) throw new RangeError(`subgroup mean and sd must be finite (sd ≥ 0), got ${stat.mean} and ${stat.s}`);
  }
  const totalSize = stats.reduce((sum, stat) => sum + stat.size, 0);
  const center = stats.reduce((sum, stat) => sum + stat.size * stat.mean, 0) / totalSize;
  const firstSize = stats[0]?.size ?? 0;
  const pooled = stats.some((stat) => stat.size !== firstSize);
  const degreesOfFreedom = totalSize - stats.length;
  const sBar = pooled
    ? Math.sqrt(stats.reduce((sum, stat) => sum + (stat.size - 1) * stat.s * stat.s, 0) / degreesOfFreedom)
    : mean(stats.map((stat) => stat.s));
  const withinSigma = sBar / c4(pooled ? degreesOfFreedom + 1 : firstSize);
  const points = stats.map((stat) => {
    const limits = xbarSLimits(center, sBar, stat.size);
    const zScore = (stat.mean - center) / limits.sigma;
    return { size: stat.size, mean: stat.mean, s: stat.s, ...limits, zScore, zones: zoneBoundaries(center, limits.sigma) };
  });
  return { center, sBar, withinSigma, pooled, points };
}
