// Summary statistics and the printed tables of `npm run bench:map`.

/**
 * The q-quantile (0 ≤ q ≤ 1) of `values` by linear interpolation between order statistics, h = (n − 1)·q
 * (Hyndman & Fan 1996, definition 7). NaN for an empty list; RangeError for q outside [0, 1].
 */
export function quantile(values: readonly number[], q: number): number {
  if (!(q >= 0 && q <= 1)) throw new RangeError(`q must be within [0, 1], got ${q}`);
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const h = (sorted.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

/** Median, quantile(values, 0.5). */
export const median = (values: readonly number[]): number => quantile(values, 0.5);

/**
 * Frames missed between consecutive rAF timestamps (ms): Σ max(0, round(Δt / intervalMs) − 1), intervalMs the
 * display's frame interval (16.7 ms at 60 Hz). 0 for fewer than two timestamps; RangeError unless intervalMs > 0.
 */
export function droppedFrames(frameTimesMs: readonly number[], intervalMs: number): number {
  if (!(intervalMs > 0)) throw new RangeError(`intervalMs must be positive, got ${intervalMs}`);
  let dropped = 0;
  for (let i = 1; i < frameTimesMs.length; i++) dropped += Math.max(0, Math.round((frameTimesMs[i]! - frameTimesMs[i - 1]!) / intervalMs) - 1);
  return dropped;
}

/** Consecutive differences of a list of timestamps (ms); empty for fewer than two. */
export function intervals(timesMs: readonly number[]): number[] {
  return timesMs.slice(1).map((t, i) => t - timesMs[i]!);
}

/** A plain-text table: a header row, a rule, then rows, each column right-aligned to its widest cell. */
export function formatTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const widths = header.map((h, c) => Math.max(h.length, ...rows.map((r) => (r[c] ?? "").length)));
  const line = (cells: readonly string[]) => cells.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]!) : cell.padStart(widths[c]!))).join("  ");
  return [line(header), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n");
}

/** A number with `digits` decimals, or "—" when it is not finite. */
export function fixed(value: number, digits = 0): string {
  return Number.isFinite(value) ? value.toFixed(digits) : "—";
}
