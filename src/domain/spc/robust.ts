import { normalQuantile } from "./special-functions";

// Edge behaviour shared by every function here: an empty sample, or one containing NaN, gives NaN
// (like arithmetic on a missing value) rather than throwing, so a wafer with no usable dies stays a
// number the caller can test; ±Infinity sorts as an ordinary order statistic.

/** Normal consistency factor of the MAD, 1/Φ⁻¹(3/4) = 1.482602… (Hampel 1974), usually quoted as 1.4826. */
export const MAD_NORMAL_CONSISTENCY = 1 / normalQuantile(0.75);

/** AEC-Q001's divisor for robust sigma, (Q₃ − Q₁)/1.35; 1.35 rounds 2Φ⁻¹(3/4) = 1.34898, the normal IQR in σ. */
export const AEC_Q001_IQR_DIVISOR = 1.35;

/** p-quantile, Hyndman & Fan (1996) type 7: sorted x₀…xₙ₋₁, h = (n − 1)p, x⌊h⌋ + (h − ⌊h⌋)(x⌊h⌋₊₁ − x⌊h⌋) (R's default); one value → that value; empty or NaN → NaN; RangeError for p outside [0, 1]. */
export function quantile(values: readonly number[], p: number): number {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`quantile needs 0 ≤ p ≤ 1, got ${p}`);
  const sorted = sortedOrNull(values);
  return sorted === null ? Number.NaN : quantileOfSorted(sorted, p);
}

/** Median, the type-7 quantile at p = ½: the middle value, or the mean of the two middle values for even n; empty or NaN → NaN. */
export function median(values: readonly number[]): number {
  return quantile(values, 0.5);
}

/** Robust σ̂ = 1.4826·median|xᵢ − median x| (MAD with its normal consistency factor), same units as x; one value or no spread → 0; empty or NaN → NaN. */
export function madSigma(values: readonly number[]): number {
  const centre = median(values);
  if (Number.isNaN(centre)) return Number.NaN;
  return MAD_NORMAL_CONSISTENCY * median(values.map((value) => Math.abs(value - centre)));
}

/** Robust σ̂ = (Q₃ − Q₁)/1.35 as AEC-Q001 defines it, quartiles by type 7 (the guideline fixes no quartile rule), same units as x; one value or no spread → 0; empty or NaN → NaN. */
export function iqrSigma(values: readonly number[]): number {
  const sorted = sortedOrNull(values);
  if (sorted === null) return Number.NaN;
  return (quantileOfSorted(sorted, 0.75) - quantileOfSorted(sorted, 0.25)) / AEC_Q001_IQR_DIVISOR;
}

function sortedOrNull(values: readonly number[]): number[] | null {
  if (values.length === 0 || values.some(Number.isNaN)) return null;
  return [...values].sort((a, b) => a - b);
}

function quantileOfSorted(sorted: readonly number[], p: number): number {
  const h = (sorted.length - 1) * p;
  const lowIndex = Math.floor(h);
  const low = sorted[lowIndex] ?? Number.NaN;
  const fraction = h - lowIndex;
  // Skipping the interpolation when it has no weight keeps 0·(∞ − x) from turning an exact hit into NaN.
  if (fraction === 0) return low;
  const high = sorted[lowIndex + 1] ?? low;
  return low + fraction * (high - low);
}
