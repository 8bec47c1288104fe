import { assertFinite, mean } from "./sample-stats";

// A quick look at whether a baseline could be normal, shown beside its histogram before limits are frozen.

/** Below this many values the hint says nothing: the Jarque–Bera χ² approximation is poor (common practice). */
export const NORMALITY_MIN_VALUES = 8;
/** p below this reads as "not normal-looking" (the usual 5 % level, common practice). */
export const NORMALITY_ALPHA = 0.05;

export interface NormalityHint {
  readonly n: number;
  /** Population skewness m₃/m₂^(3/2); null below 3 values or with zero spread. */
  readonly skewness: number | null;
  /** Population excess kurtosis m₄/m₂² − 3; null below 3 values or with zero spread. */
  readonly excessKurtosis: number | null;
  /** JB = n/6·(S² + K²/4); null when skewness is. */
  readonly jarqueBera: number | null;
  /** P(χ²₂ ≥ JB) = e^(−JB/2); null when JB is. */
  readonly pValue: number | null;
  readonly verdict: "too few values" | "no spread" | "consistent with normal" | "not normal-looking";
}

/** Jarque–Bera normality hint (Jarque & Bera 1980, from memory): S, K from central moments mₖ = Σ(xᵢ − x̄)ᵏ/n, JB = n/6·(S² + K²/4) ~ χ²₂ under normality, p = e^(−JB/2) (the χ²₂ survival function); verdict "too few values" below 8 values, "no spread" when m₂ = 0; RangeError on a non-finite value. */
export function normalityHint(values: readonly number[]): NormalityHint {
  assertFinite(values, "normality values");
  const n = values.length;
  const empty = { n, skewness: null, excessKurtosis: null, jarqueBera: null, pValue: null } as const;
  if (n < 3) return { ...empty, verdict: "too few values" };
  const centre = mean(values);
  const moment = (k: number) => values.reduce((sum, value) => sum + (value - centre) ** k, 0) / n;
  const m2 = moment(2);
  if (m2 === 0) return { ...empty, verdict: n < NORMALITY_MIN_VALUES ? "too few values" : "no spread" };
  const skewness = moment(3) / m2 ** 1.5;
  const excessKurtosis = moment(4) / (m2 * m2) - 3;
  const jarqueBera = (n / 6) * (skewness ** 2 + excessKurtosis ** 2 / 4);
  const pValue = Math.exp(-jarqueBera / 2);
  const verdict = n < NORMALITY_MIN_VALUES ? "too few values" : pValue < NORMALITY_ALPHA ? "not normal-looking" : "consistent with normal";
  return { n, skewness, excessKurtosis, jarqueBera, pValue, verdict };
}
