import { CONDUCTANCE_QUANTUM_S } from "./constants";
import { CubicAccumulator, nonlinearityIndex } from "./cubic-fit";
import { suggestedWindowV } from "./device-model";
import { DistinctCounter } from "./distinct-values";
import { formatPlain, formatSi } from "./format-si";
import { LinearAccumulator } from "./linear-fit";

export type Bin = "NODATA" | "SHORT" | "OPEN" | "NONLINEAR" | "LOW" | "HIGH" | "PASS";
/** The bins in PRODUCT §5 first-match order. */
export const BINS: readonly Bin[] = Object.freeze(["NODATA", "SHORT", "OPEN", "NONLINEAR", "LOW", "HIGH", "PASS"]);

export interface IvPoint {
  biasV: number;
  currentA: number;
  /** The source hit its compliance limit on this point. */
  compliance: boolean;
}

export interface ExtractionSettings {
  /** w in V_w = w·kT/q. */
  windowFactor: number;
  /** η_max. */
  nonlinearityMax: number;
  openBelowS: number | null;
  shortAboveS: number | null;
  specLowS: number | null;
  specHighS: number | null;
}

/** PRODUCT §5 defaults: w = 0.5, η_max = 0.02, no thresholds. */
export const DEFAULT_EXTRACTION: ExtractionSettings = Object.freeze({
  windowFactor: 0.5,
  nonlinearityMax: 0.02,
  openBelowS: null,
  shortAboveS: null,
  specLowS: null,
  specHighS: null,
});

/** The §5 results of one die; conductanceS, offsetA, r2, nonlinearity and modes are null exactly when bin is NODATA. */
export interface DieResult {
  conductanceS: number | null;
  offsetA: number | null;
  r2: number | null;
  pointsInWindow: number;
  windowV: number;
  nonlinearity: number | null;
  /** η came from a sweep that never left the window. */
  nonlinearityWindowOnly: boolean;
  modes: number | null;
  bin: Bin;
  /** A short sentence for every bin but PASS. */
  reason: string | null;
  temperatureK: number;
}

// Reused across calls: analyzeDieArrays runs for millions of dies and must not allocate per point.
const linear = new LinearAccumulator();
const cubic = new CubicAccumulator();
const windowBiases = new DistinctCounter(3);
const sweepBiases = new DistinctCounter(5);
let scratchBias = new Float64Array(64);
let scratchCurrent = new Float64Array(64);
let scratchCompliance = new Uint8Array(64);

/**
 * PRODUCT §5 per die from parallel arrays (first n entries): V_w = w·kT/q; OLS I = G·V + I₀ over |V| ≤ V_w (≥ 3
 * distinct biases); η from the cubic over the whole sweep (≥ 5 distinct biases; from the window points when the sweep
 * never leaves it); bins first match: NODATA (too few biases, any non-finite value or temperature, G < 0 beyond
 * 3 standard errors) · SHORT (any compliance point or G > shortAboveS) · OPEN · NONLINEAR · LOW · HIGH · PASS.
 * Settings are taken as already validated; a die's arrays are read, never kept.
 */
export function analyzeDieArrays(
  bias: Float64Array,
  current: Float64Array,
  compliance: Uint8Array,
  n: number,
  settings: ExtractionSettings,
  temperatureK: number,
): DieResult {
  const windowV = suggestedWindowV(temperatureK, settings.windowFactor);
  if (!(temperatureK >= 0 && Number.isFinite(temperatureK))) {
    return noData(0, windowV, temperatureK, `temperature ${temperatureK} K is not usable`);
  }
  linear.reset();
  cubic.reset();
  windowBiases.reset(3);
  sweepBiases.reset(5);
  let firstNonFinite = -1;
  let compliancePoints = 0;
  let sweepLeavesWindow = false;
  for (let i = 0; i < n; i++) {
    const biasV = bias[i] as number;
    const currentA = current[i] as number;
    if (!Number.isFinite(biasV) || !Number.isFinite(currentA)) {
      if (firstNonFinite < 0) firstNonFinite = i;
      continue;
    }
    if (compliance[i]) compliancePoints++;
    cubic.add(biasV, currentA);
    sweepBiases.add(biasV);
    if (Math.abs(biasV) <= windowV) {
      linear.add(biasV, currentA);
      windowBiases.add(biasV);
    } else {
      sweepLeavesWindow = true;
    }
  }
  const inWindow = linear.n;
  if (firstNonFinite >= 0) return noData(inWindow, windowV, temperatureK, `non-finite bias or current at point ${firstNonFinite + 1}`);
  const fit = windowBiases.count >= 3 ? linear.fit() : null;
  if (fit === null) {
    const k = windowBiases.count;
    return noData(inWindow, windowV, temperatureK, `${k} distinct ${k === 1 ? "bias" : "biases"} within ±${formatSi(windowV, "V")} (need 3)`);
  }
  const conductanceS = fit.conductanceS;
  if (conductanceS < 0 && -conductanceS > 3 * fit.slopeStdErrS) {
    const noise = formatSi(3 * fit.slopeStdErrS, "S");
    return noData(inWindow, windowV, temperatureK, `G = ${formatSi(conductanceS, "S")} is negative beyond noise (3σ = ${noise})`);
  }
  const cubicFit = sweepBiases.count >= 5 ? cubic.fit() : null;
  const nonlinearity = cubicFit === null ? null : nonlinearityIndex(cubicFit, windowV);
  const windowOnly = nonlinearity !== null && !sweepLeavesWindow;

  let bin: Bin = "PASS";
  let reason: string | null = null;
  if (compliancePoints > 0) {
    bin = "SHORT";
    reason = `${compliancePoints} ${compliancePoints === 1 ? "point" : "points"} at the compliance limit`;
  } else if (settings.shortAboveS !== null && conductanceS > settings.shortAboveS) {
    bin = "SHORT";
    reason = `G = ${formatSi(conductanceS, "S")} above the short threshold ${formatSi(settings.shortAboveS, "S")}`;
  } else if (settings.openBelowS !== null && conductanceS < settings.openBelowS) {
    bin = "OPEN";
    reason = `G = ${formatSi(conductanceS, "S")} below the open threshold ${formatSi(settings.openBelowS, "S")}`;
  } else if (nonlinearity !== null && nonlinearity > settings.nonlinearityMax) {
    bin = "NONLINEAR";
    const source = windowOnly ? " (from the window points only)" : "";
    reason = `nonlinearity η = ${formatPlain(nonlinearity)} above η_max ${formatPlain(settings.nonlinearityMax)}${source}`;
  } else if (settings.specLowS !== null && conductanceS < settings.specLowS) {
    bin = "LOW";
    reason = `G = ${formatSi(conductanceS, "S")} below the spec low limit ${formatSi(settings.specLowS, "S")}`;
  } else if (settings.specHighS !== null && conductanceS > settings.specHighS) {
    bin = "HIGH";
    reason = `G = ${formatSi(conductanceS, "S")} above the spec high limit ${formatSi(settings.specHighS, "S")}`;
  }
  return {
    conductanceS,
    offsetA: fit.offsetA,
    r2: fit.r2,
    pointsInWindow: inWindow,
    windowV,
    nonlinearity,
    nonlinearityWindowOnly: windowOnly,
    modes: conductanceS / CONDUCTANCE_QUANTUM_S,
    bin,
    reason,
    temperatureK,
  };
}

/** PRODUCT §5 per die from point records; same rules and results as analyzeDieArrays. */
export function analyzeDie(points: readonly IvPoint[], settings: ExtractionSettings, temperatureK: number): DieResult {
  const n = points.length;
  if (scratchBias.length < n) {
    const size = Math.max(n, 2 * scratchBias.length);
    scratchBias = new Float64Array(size);
    scratchCurrent = new Float64Array(size);
    scratchCompliance = new Uint8Array(size);
  }
  for (let i = 0; i < n; i++) {
    const point = points[i] as IvPoint;
    scratchBias[i] = point.biasV;
    scratchCurrent[i] = point.currentA;
    scratchCompliance[i] = point.compliance ? 1 : 0;
  }
  return analyzeDieArrays(scratchBias, scratchCurrent, scratchCompliance, n, settings, temperatureK);
}

function noData(pointsInWindow: number, windowV: number, temperatureK: number, reason: string): DieResult {
  return {
    conductanceS: null,
    offsetA: null,
    r2: null,
    pointsInWindow,
    windowV,
    nonlinearity: null,
    nonlinearityWindowOnly: false,
    modes: null,
    bin: "NODATA",
    reason,
    temperatureK,
  };
}
