/** A closed value range [min, max] in the caller's unit. */
export interface ValueRange {
  readonly min: number;
  readonly max: number;
}

// Colour scales clip at the 2nd and 98th percentiles so a few shorts or opens do not flatten the scale (common practice).
const LOW_QUANTILE = 0.02;
const HIGH_QUANTILE = 0.98;

function quantileOfSorted(sorted: readonly number[], p: number): number {
  const position = (sorted.length - 1) * p;
  const lower = Math.floor(position);
  const a = sorted[lower] as number;
  const b = sorted[Math.min(lower + 1, sorted.length - 1)] as number;
  return a + (b - a) * (position - lower);
}

/**
 * Colour-scale range of the finite values: 2nd to 98th percentile with linear interpolation between order
 * statistics (Hyndman & Fan type 7, published). A zero-width range is widened to v ± 5 % (± 1 when v = 0);
 * null when no value is finite.
 */
export function colourScaleRange(values: readonly (number | null)[]): ValueRange | null {
  const finite = values.filter((v): v is number => v !== null && Number.isFinite(v)).sort((a, b) => a - b);
  if (finite.length === 0) return null;
  const min = quantileOfSorted(finite, LOW_QUANTILE);
  const max = quantileOfSorted(finite, HIGH_QUANTILE);
  if (max > min) return { min, max };
  const half = min === 0 ? 1 : Math.abs(min) * 0.05;
  return { min: min - half, max: max + half };
}
