/** Default negative-binomial cluster parameter α; from memory: α = 2 is a commonly quoted default. */
export const DEFAULT_CLUSTER_ALPHA = 2;

export interface DefectDensityFit {
  readonly wafers: number;
  /** Unweighted mean of the wafer yields, 0–1. */
  readonly meanYield: number;
  readonly areaCm2: number;
  readonly alpha: number;
  readonly poissonD0PerCm2: number;
  readonly murphyD0PerCm2: number;
  readonly negativeBinomialD0PerCm2: number;
}

function checkArea(areaCm2: number, allowZero: boolean): void {
  if (!Number.isFinite(areaCm2) || areaCm2 < 0 || (!allowZero && areaCm2 === 0)) {
    throw new RangeError(`die area must be a ${allowZero ? "non-negative" : "positive"} number of cm², got ${areaCm2}`);
  }
}

function checkDensity(d0PerCm2: number): void {
  if (!Number.isFinite(d0PerCm2) || d0PerCm2 < 0) throw new RangeError(`D₀ must be a non-negative number per cm², got ${d0PerCm2}`);
}

function checkAlpha(alpha: number): void {
  if (Number.isNaN(alpha) || alpha <= 0) throw new RangeError(`cluster parameter α must be positive, got ${alpha}`);
}

function checkYield(yieldFraction: number): void {
  if (!(yieldFraction >= 0 && yieldFraction <= 1)) throw new RangeError(`yield must lie in [0, 1], got ${yieldFraction}`);
}

/** Murphy's Y as a function of λ = A·D₀, ((1 − e^(−λ))/λ)², written with expm1 so small λ keeps its precision; 1 at λ = 0. */
function murphyOfProduct(lambda: number): number {
  if (lambda === 0) return 1;
  const ratio = -Math.expm1(-lambda) / lambda;
  return ratio * ratio;
}

/** Die area in cm² from die width and height in mm: w·h / 100. */
export function dieAreaCm2(dieWidthMm: number, dieHeightMm: number): number {
  return (dieWidthMm * dieHeightMm) / 100;
}

/** Poisson yield model Y = e^(−A·D₀) (§7), A in cm², D₀ per cm²; 1 at A·D₀ = 0. RangeError on negative or non-finite inputs. */
export function poissonYield(areaCm2: number, d0PerCm2: number): number {
  checkArea(areaCm2, true);
  checkDensity(d0PerCm2);
  return Math.exp(-areaCm2 * d0PerCm2);
}

/** Murphy yield model Y = ((1 − e^(−A·D₀))/(A·D₀))² (§7), A in cm², D₀ per cm²; 1 at A·D₀ = 0. RangeError on negative or non-finite inputs. */
export function murphyYield(areaCm2: number, d0PerCm2: number): number {
  checkArea(areaCm2, true);
  checkDensity(d0PerCm2);
  return murphyOfProduct(areaCm2 * d0PerCm2);
}

/**
 * Negative-binomial yield model Y = (1 + A·D₀/α)^(−α) (§7), A in cm², D₀ per cm², α the cluster parameter
 * (α = 1 is Seeds' model; α = Infinity gives the Poisson limit). RangeError on α ≤ 0 or bad A, D₀.
 */
export function negativeBinomialYield(areaCm2: number, d0PerCm2: number, alpha: number): number {
  checkArea(areaCm2, true);
  checkDensity(d0PerCm2);
  checkAlpha(alpha);
  const lambda = areaCm2 * d0PerCm2;
  if (alpha === Number.POSITIVE_INFINITY) return Math.exp(-lambda);
  return Math.exp(-alpha * Math.log1p(lambda / alpha));
}

/** Poisson inversion D₀ = −ln(Y)/A per cm² (A in cm², A > 0); Y = 1 → 0, Y = 0 → Infinity, Y outside [0, 1] → RangeError. */
export function d0Poisson(yieldFraction: number, areaCm2: number): number {
  checkYield(yieldFraction);
  checkArea(areaCm2, false);
  if (yieldFraction === 1) return 0;
  return -Math.log(yieldFraction) / areaCm2;
}

/**
 * Negative-binomial inversion D₀ = α(Y^(−1/α) − 1)/A per cm² (closed form, evaluated as α·expm1(−ln Y/α)/A);
 * α = Infinity gives the Poisson inversion. Y = 1 → 0, Y = 0 → Infinity, Y outside [0, 1], A ≤ 0 or α ≤ 0 → RangeError.
 */
export function d0NegativeBinomial(yieldFraction: number, areaCm2: number, alpha: number): number {
  checkYield(yieldFraction);
  checkArea(areaCm2, false);
  checkAlpha(alpha);
  if (yieldFraction === 1) return 0;
  if (yieldFraction === 0) return Number.POSITIVE_INFINITY;
  if (alpha === Number.POSITIVE_INFINITY) return d0Poisson(yieldFraction, areaCm2);
  return (alpha * Math.expm1(-Math.log(yieldFraction) / alpha)) / areaCm2;
}

/**
 * Murphy inversion: D₀ per cm² solving ((1 − e^(−λ))/λ)² = Y for λ = A·D₀. No closed form is used: Murphy's Y falls
 * monotonically from 1 to 0 as λ grows, so λ is bracketed by doubling and then bisected to the last floating-point
 * step. Y = 1 → 0, Y = 0 → Infinity, Y outside [0, 1] or A ≤ 0 → RangeError.
 */
export function d0Murphy(yieldFraction: number, areaCm2: number): number {
  checkYield(yieldFraction);
  checkArea(areaCm2, false);
  if (yieldFraction === 1) return 0;
  if (yieldFraction === 0) return Number.POSITIVE_INFINITY;
  let low = 0;
  let high = 1;
  while (murphyOfProduct(high) > yieldFraction) {
    low = high;
    high *= 2;
  }
  // Each pass halves the bracket; 2200 passes cover the whole double range, so the guard never cuts a real search short.
  for (let pass = 0; pass < 2200; pass++) {
    const mid = low + (high - low) / 2;
    if (mid <= low || mid >= high) break;
    if (murphyOfProduct(mid) > yieldFraction) low = mid;
    else high = mid;
  }
  return (low + (high - low) / 2) / areaCm2;
}

/**
 * D₀ per cm² of each model, fitted to the unweighted mean of the wafer yields (each 0–1) for one die area in cm².
 * The mean yield is inverted, rather than averaging per-wafer D₀, because one zero-yield wafer would make every
 * average infinite and D₀(Y) is convex, so averaging per-wafer values biases D₀ upward. RangeError on no wafers.
 */
export function fitDefectDensity(
  yields: readonly number[],
  areaCm2: number,
  alpha: number = DEFAULT_CLUSTER_ALPHA,
): DefectDensityFit {
  if (yields.length === 0) throw new RangeError("fitDefectDensity needs at least one wafer yield");
  yields.forEach(checkYield);
  checkArea(areaCm2, false);
  checkAlpha(alpha);
  const meanYield = yields.reduce((sum, y) => sum + y, 0) / yields.length;
  return {
    wafers: yields.length,
    meanYield,
    areaCm2,
    alpha,
    poissonD0PerCm2: d0Poisson(meanYield, areaCm2),
    murphyD0PerCm2: d0Murphy(meanYield, areaCm2),
    negativeBinomialD0PerCm2: d0NegativeBinomial(meanYield, areaCm2, alpha),
  };
}
