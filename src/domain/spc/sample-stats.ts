// Plain sample statistics shared by the charts and the capability indices.

/** Arithmetic mean Σxᵢ/n; empty → NaN. */
export function mean(values: readonly number[]): number {
  return values.reduce((sum, value) => sum + value, 0) / values.length;
}

/** Sample standard deviation √(Σ(xᵢ − x̄)²/(n − 1)), two-pass for accuracy; fewer than 2 values → NaN. */
export function sampleStandardDeviation(values: readonly number[]): number {
  if (values.length < 2) return Number.NaN;
  const centre = mean(values);
  const squares = values.reduce((sum, value) => sum + (value - centre) ** 2, 0);
  return Math.sqrt(squares / (values.length - 1));
}

/** RangeError naming the first non-finite entry; `what` names the input in the message. */
export function assertFinite(values: readonly number[], what: string): void {
  const bad = values.findIndex((value) => !Number.isFinite(value));
  if (bad >= 0) throw new RangeError(`${what} must be finite; value ${bad} is ${values[bad]}`);
}
