import { thermalEnergyEv } from "./constants";
import { logisticOccupation } from "./fermi";

export interface QuadratureResult {
  value: number;
  /** Sum over subintervals of |K15 − G7|, a conservative bound in practice. */
  errorEstimate: number;
  converged: boolean;
}

export interface QuadratureOptions {
  relTol?: number;
  absTol?: number;
  maxIntervals?: number;
}

// 15-point Kronrod extension of the 7-point Gauss rule on [−1, 1], from QUADPACK's qk15 (Piessens et al.,
// 1983), from memory; the exactness tests in quadrature.test.ts check every digit that matters.
const XGK = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851, 0.864864423359769072789712788640926,
  0.741531185599394439863864773280788, 0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0,
];
const WGK = [
  0.02293532201052922496373200805897, 0.063092092629978553290700663189204, 0.104790010322250183839876322541518,
  0.140653259715525918745189590510238, 0.16900472663926790282658342659855, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];
// Gauss weights for the nodes XGK[1], XGK[3], XGK[5], XGK[7].
const WG = [0.129484966168869693270611432679082, 0.27970539148927666790146777142378, 0.381830050505118944950369775488975, 0.417959183673469387755102040816327];

/** One G7K15 panel on [a, b]: writes the Kronrod value into `out[0]` and |K15 − G7| into `out[1]`. */
function gaussKronrod15(fn: (x: number) => number, a: number, b: number, out: Float64Array): void {
  const centre = 0.5 * (a + b);
  const half = 0.5 * (b - a);
  const fc = fn(centre);
  let kronrod = fc * (WGK[7] as number);
  let gauss = fc * (WG[3] as number);
  for (let j = 0; j < 7; j++) {
    const dx = half * (XGK[j] as number);
    const pair = fn(centre - dx) + fn(centre + dx);
    kronrod += (WGK[j] as number) * pair;
    if (j % 2 === 1) gauss += (WG[(j - 1) / 2] as number) * pair;
  }
  out[0] = kronrod * half;
  out[1] = Math.abs((kronrod - gauss) * half);
}

/**
 * ∫ₐᵇ fn(x) dx by globally adaptive Gauss–Kronrod G7K15 (QUADPACK QAG strategy: bisect the panel with the largest
 * error until Σ|K15 − G7| ≤ max(absTol, relTol·|I|)). The interval is first split at `breakpoints` inside (a, b) so
 * no panel straddles a kink. Defaults relTol 1e-12, absTol 0, 2000 panels; converged = false when the budget ran out
 * or a panel became too narrow to split. a = b gives 0; a > b gives −∫ᵦᵃ.
 */
export function integrateAdaptive(
  fn: (x: number) => number,
  a: number,
  b: number,
  breakpoints: readonly number[] = [],
  options: QuadratureOptions = {},
): QuadratureResult {
  if (a === b) return { value: 0, errorEstimate: 0, converged: true };
  if (a > b) {
    const flipped = integrateAdaptive(fn, b, a, breakpoints, options);
    return { ...flipped, value: -flipped.value };
  }
  const relTol = options.relTol ?? 1e-12;
  const absTol = options.absTol ?? 0;
  const cuts = [a, ...breakpoints.filter((x) => x > a && x < b).sort((p, q) => p - q), b];
  const maxIntervals = Math.max(options.maxIntervals ?? 2000, cuts.length - 1);
  const panels = new PanelHeap();
  const out = new Float64Array(2);
  for (let i = 0; i + 1 < cuts.length; i++) {
    const lo = cuts[i] as number;
    const hi = cuts[i + 1] as number;
    if (hi <= lo) continue;
    gaussKronrod15(fn, lo, hi, out);
    panels.push(lo, hi, out[0] as number, out[1] as number);
  }
  let converged = true;
  while (panels.totalError > Math.max(absTol, relTol * Math.abs(panels.totalValue))) {
    if (panels.size >= maxIntervals) {
      converged = false;
      break;
    }
    const { lo, hi } = panels.popWorst();
    const mid = 0.5 * (lo + hi);
    if (!(mid > lo && mid < hi)) {
      converged = false;
      break;
    }
    gaussKronrod15(fn, lo, mid, out);
    panels.push(lo, mid, out[0] as number, out[1] as number);
    gaussKronrod15(fn, mid, hi, out);
    panels.push(mid, hi, out[0] as number, out[1] as number);
  }
  const errorEstimate = Math.max(panels.totalError, 0);
  return { value: panels.sumValues(), errorEstimate, converged: converged && Number.isFinite(errorEstimate) };
}

/**
 * ∫ G(E) F_T(E − μ) dE over the whole real line (PRODUCT §5), for G in S and E, μ in eV. Substitutes u = f(E)
 * (du = −F_T dE) on each side of μ, so the infinite range becomes two copies of (0, ½] with nothing truncated:
 * a window of μ ± 40 kT would drop a tail mass f(40 kT) ≈ e^(−40) ≈ 4.2e−18 (F_T there is sech²(20) ≈ 1.7e−17 of
 * its peak), which is already 4.5e−5 of the result for a band edge 30 kT above μ. Breakpoints (band edge, table
 * knots) map to u = f(b) and split the panels. T = 0 returns G(μ), the delta-function limit; RangeError for a
 * negative or non-finite T.
 */
export function integrateAgainstThermalBroadening(
  conductanceS: (energyEv: number) => number,
  fermiLevelEv: number,
  temperatureK: number,
  breakpointsEv: readonly number[] = [],
  options: QuadratureOptions = {},
): QuadratureResult {
  const kTEv = thermalEnergyEv(temperatureK);
  if (Number.isNaN(kTEv)) throw new RangeError(`temperature ${temperatureK} K is not a usable temperature`);
  if (kTEv === 0) return { value: conductanceS(fermiLevelEv), errorEstimate: 0, converged: true };
  // Reduced distance from μ for occupation u ∈ (0, ½]: ln((1 − u)/u), written with log1p for u near ½.
  const reduced = (u: number) => Math.log1p((1 - 2 * u) / u);
  const above = (u: number) => conductanceS(fermiLevelEv + kTEv * reduced(u));
  const below = (u: number) => conductanceS(fermiLevelEv - kTEv * reduced(u));
  const cutsAbove: number[] = [];
  const cutsBelow: number[] = [];
  for (const e of breakpointsEv) {
    const x = (e - fermiLevelEv) / kTEv;
    if (x > 0) cutsAbove.push(logisticOccupation(x));
    else if (x < 0) cutsBelow.push(logisticOccupation(-x));
  }
  const tol = { ...options, relTol: (options.relTol ?? 1e-12) * 0.5, absTol: (options.absTol ?? 0) * 0.5 };
  const upper = integrateAdaptive(above, 0, 0.5, cutsAbove, tol);
  const lower = integrateAdaptive(below, 0, 0.5, cutsBelow, tol);
  return {
    value: upper.value + lower.value,
    errorEstimate: upper.errorEstimate + lower.errorEstimate,
    converged: upper.converged && lower.converged,
  };
}

interface Panel {
  lo: number;
  hi: number;
  value: number;
  error: number;
}

/** Max-heap of panels keyed by error, with a running error total; values are re-summed at the end. */
class PanelHeap {
  private panels: Panel[] = [];
  totalValue = 0;
  totalError = 0;

  get size(): number {
    return this.panels.length;
  }

  push(lo: number, hi: number, value: number, error: number): void {
    const heap = this.panels;
    heap.push({ lo, hi, value, error });
    this.totalValue += value;
    this.totalError += error;
    for (let i = heap.length - 1; i > 0; ) {
      const parent = (i - 1) >> 1;
      if ((heap[parent] as Panel).error >= error) break;
      [heap[i], heap[parent]] = [heap[parent] as Panel, heap[i] as Panel];
      i = parent;
    }
  }

  popWorst(): Panel {
    const heap = this.panels;
    const top = heap[0] as Panel;
    const last = heap.pop() as Panel;
    this.totalValue -= top.value;
    this.totalError -= top.error;
    if (heap.length === 0) return top;
    heap[0] = last;
    for (let i = 0; ; ) {
      const l = 2 * i + 1;
      let worst = i;
      if (l < heap.length && (heap[l] as Panel).error > (heap[worst] as Panel).error) worst = l;
      if (l + 1 < heap.length && (heap[l + 1] as Panel).error > (heap[worst] as Panel).error) worst = l + 1;
      if (worst === i) break;
      [heap[i], heap[worst]] = [heap[worst] as Panel, heap[i] as Panel];
      i = worst;
    }
    return top;
  }

  sumValues(): number {
    let sum = 0;
    for (const p of this.panels) sum += p.value;
    return sum;
  }
}
