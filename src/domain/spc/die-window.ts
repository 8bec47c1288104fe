import { iqrSigma, madSigma, median } from "./robust";

/** The out-of-window band the wafer map flags (§6): centre ± k·σ̂ on die conductance, in siemens. */
export interface DieWindow {
  readonly lowS: number;
  readonly highS: number;
  readonly centerS: number;
  readonly sigmaS: number;
  readonly k: number;
  readonly method: "static" | "pat";
}

/** Static die window: median ± k·1.4826·MAD over the baseline dies' G in S (k default 3; §6, common practice); non-finite G skipped, null when none remain; zero spread collapses the window onto the median; RangeError for k not finite ≥ 0. */
export function staticDieWindow(baselineConductancesS: readonly number[], k = 3): DieWindow | null {
  return robustWindow(baselineConductancesS, k, "static", madSigma);
}

/** Dynamic Part Average Testing window (AEC-Q001): robust mean (median) ± k·(Q₃ − Q₁)/1.35 over one wafer's PASS dies' G in S (k default 6); non-finite G skipped, null when none remain; zero spread collapses the window onto the median; RangeError for k not finite ≥ 0. */
export function patDieWindow(passDieConductancesS: readonly number[], k = 6): DieWindow | null {
  return robustWindow(passDieConductancesS, k, "pat", iqrSigma);
}

/** True when G (S) lies strictly outside [lowS, highS]: a die exactly on a limit is inside, and a collapsed window flags every G but its centre; non-finite G → false (NODATA dies are flagged by their bin, not by the window). */
export function isOutOfWindow(conductanceS: number, window: DieWindow): boolean {
  if (!Number.isFinite(conductanceS)) return false;
  return conductanceS < window.lowS || conductanceS > window.highS;
}

function robustWindow(
  conductancesS: readonly number[],
  k: number,
  method: DieWindow["method"],
  robustSigma: (values: readonly number[]) => number,
): DieWindow | null {
  if (!Number.isFinite(k) || k < 0) throw new RangeError(`die window needs a finite k ≥ 0, got ${k}`);
  const finite = conductancesS.filter(Number.isFinite);
  if (finite.length === 0) return null;
  const centerS = median(finite);
  const sigmaS = robustSigma(finite);
  return { lowS: centerS - k * sigmaS, highS: centerS + k * sigmaS, centerS, sigmaS, k, method };
}
