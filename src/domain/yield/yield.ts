/** Die bins of §5 step 4, in first-match order. Local to yield/ until it is unified with domain/transport. */
export type Bin = "NODATA" | "SHORT" | "OPEN" | "NONLINEAR" | "LOW" | "HIGH" | "PASS";

/** Every bin in §5 first-match order; fixes the order of counts and Pareto ties. */
export const BINS: readonly Bin[] = ["NODATA", "SHORT", "OPEN", "NONLINEAR", "LOW", "HIGH", "PASS"];

export interface WaferYield {
  /** Every die with a bin, NODATA included. */
  readonly tested: number;
  readonly pass: number;
  /** pass / tested; null when nothing was tested. */
  readonly yield: number | null;
  /** PASS dies that are not inked. */
  readonly shippedPass: number;
  /** shippedPass / tested; null when nothing was tested. */
  readonly shippedYield: number | null;
}

export interface ParetoEntry {
  readonly bin: Exclude<Bin, "PASS">;
  readonly count: number;
  /** Share of all failing dies, 0–100. */
  readonly percentOfFails: number;
  /** Running total of percentOfFails down the sorted list, 0–100. */
  readonly cumulativePercent: number;
}

function ratioOrNull(numerator: number, denominator: number): number | null {
  return denominator === 0 ? null : numerator / denominator;
}

/**
 * Wafer yield = PASS / tested (§7). Every die counts as tested, NODATA too: a die the probe landed on but that
 * gave no usable result is not shippable, so it counts as a fail. Shipped yield also counts inked PASS dies
 * (out-of-window, §6) as fails. `inked[i]` belongs to `bins[i]`; RangeError when the lengths differ.
 * Yields are null for an empty wafer.
 */
export function waferYield(bins: readonly Bin[], inked?: readonly boolean[]): WaferYield {
  if (inked !== undefined && inked.length !== bins.length) {
    throw new RangeError(`inked has ${inked.length} entries for ${bins.length} dies`);
  }
  let pass = 0;
  let shippedPass = 0;
  bins.forEach((bin, i) => {
    if (bin !== "PASS") return;
    pass++;
    if (inked?.[i] !== true) shippedPass++;
  });
  const tested = bins.length;
  return {
    tested,
    pass,
    yield: ratioOrNull(pass, tested),
    shippedPass,
    shippedYield: ratioOrNull(shippedPass, tested),
  };
}

/** Count of dies per bin, every bin present (zero when absent). */
export function binCounts(bins: readonly Bin[]): Record<Bin, number> {
  const counts: Record<Bin, number> = { NODATA: 0, SHORT: 0, OPEN: 0, NONLINEAR: 0, LOW: 0, HIGH: 0, PASS: 0 };
  for (const bin of bins) counts[bin]++;
  return counts;
}

/**
 * Bin Pareto of the failing bins (everything but PASS): bins with at least one die, sorted by count descending
 * (ties in §5 bin order), with each bin's percent of all fails and the cumulative percent. Empty when nothing failed.
 */
export function binPareto(bins: readonly Bin[]): ParetoEntry[] {
  const counts = binCounts(bins);
  const failBins = BINS.filter((bin): bin is Exclude<Bin, "PASS"> => bin !== "PASS" && counts[bin] > 0);
  const totalFails = failBins.reduce((sum, bin) => sum + counts[bin], 0);
  const sorted = [...failBins].sort((a, b) => counts[b] - counts[a] || BINS.indexOf(a) - BINS.indexOf(b));
  let runningFails = 0;
  return sorted.map((bin) => {
    runningFails += counts[bin];
    return {
      bin,
      count: counts[bin],
      percentOfFails: (100 * counts[bin]) / totalFails,
      cumulativePercent: (100 * runningFails) / totalFails,
    };
  });
}

/**
 * Median of the finite values (middle value, or mean of the two middle values for an even count).
 * Non-finite values (e.g. NODATA dies without a conductance) are skipped; null when no finite value remains.
 */
export function medianOf(values: readonly number[]): number | null {
  const sorted = values.filter(Number.isFinite).sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  const upper = sorted[mid];
  const lower = sorted.length % 2 === 1 ? upper : sorted[mid - 1];
  if (upper === undefined || lower === undefined) return null;
  return lower + (upper - lower) / 2;
}
