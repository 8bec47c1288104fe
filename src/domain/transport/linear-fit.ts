import { DistinctCounter } from "./distinct-values";
import type { IvPoint } from "./linear-response";

export interface LinearFit {
  conductanceS: number;
  offsetA: number;
  /** Coefficient of determination; null when the currents have no spread. */
  r2: number | null;
  n: number;
  /** OLS standard error of the slope, √(SS_res/(n − 2)/S_VV). */
  slopeStdErrS: number;
}

/** Single-pass OLS sums for I = G·V + I₀ with Welford-style centred updates, so a large offset costs no precision. */
export class LinearAccumulator {
  n = 0;
  private meanV = 0;
  private meanI = 0;
  private svv = 0;
  private svi = 0;
  private sii = 0;

  reset(): void {
    this.n = 0;
    this.meanV = 0;
    this.meanI = 0;
    this.svv = 0;
    this.svi = 0;
    this.sii = 0;
  }

  add(biasV: number, currentA: number): void {
    this.n++;
    const dv = biasV - this.meanV;
    const di = currentA - this.meanI;
    this.meanV += dv / this.n;
    this.meanI += di / this.n;
    this.svv += dv * (biasV - this.meanV);
    this.svi += dv * (currentA - this.meanI);
    this.sii += di * (currentA - this.meanI);
  }

  /** The fit, or null below 3 points or with no spread in bias. */
  fit(): LinearFit | null {
    if (this.n < 3 || !(this.svv > 0)) return null;
    const conductanceS = this.svi / this.svv;
    const residual = Math.max(this.sii - conductanceS * this.svi, 0);
    return {
      conductanceS,
      offsetA: this.meanI - conductanceS * this.meanV,
      r2: this.sii > 0 ? 1 - residual / this.sii : null,
      n: this.n,
      slopeStdErrS: Math.sqrt(residual / (this.n - 2) / this.svv),
    };
  }
}

const accumulator = new LinearAccumulator();
const distinct = new DistinctCounter(3);

/**
 * OLS fit of I = G·V + I₀ (S, A) over the points with |V| ≤ V_w (PRODUCT §5 step 2). Returns null below 3 distinct
 * in-window biases or when any point has a non-finite bias or current.
 */
export function fitLinearResponse(points: readonly IvPoint[], windowV: number): LinearFit | null {
  accumulator.reset();
  distinct.reset(3);
  for (const { biasV, currentA } of points) {
    if (!Number.isFinite(biasV) || !Number.isFinite(currentA)) return null;
    if (Math.abs(biasV) > windowV) continue;
    accumulator.add(biasV, currentA);
    distinct.add(biasV);
  }
  return distinct.count < 3 ? null : accumulator.fit();
}
