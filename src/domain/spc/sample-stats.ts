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

/** A group of values reduced to its size, mean and sample sd (n − 1 divisor). */
export interface GroupSummary {
  readonly size: number;
  readonly mean: number;
  readonly s: number;
}

/**
 * The size, mean and sample sd of all the groups' values together, from the groups' own summaries (the pairwise
 * combination of Chan, Golub and LeVeque, "Algorithms for computing the sample variance", 1979): N = Σnᵢ,
 * x̄ = Σnᵢx̄ᵢ/N, s² = Σ((nᵢ − 1)sᵢ² + nᵢ(x̄ᵢ − x̄)²)/(N − 1). A group of one value has sd 0 (or NaN, taken as 0);
 * no values give NaN mean and sd, one value NaN sd.
 */
export function combineGroupSummaries(groups: readonly GroupSummary[]): GroupSummary {
  const size = groups.reduce((sum, g) => sum + g.size, 0);
  if (size === 0) return { size: 0, mean: Number.NaN, s: Number.NaN };
  const centre = groups.reduce((sum, g) => sum + g.size * g.mean, 0) / size;
  if (size < 2) return { size, mean: centre, s: Number.NaN };
  const squares = groups.reduce((sum, g) => sum + (g.size > 1 ? (g.size - 1) * g.s * g.s : 0) + g.size * (g.mean - centre) ** 2, 0);
  return { size, mean: centre, s: Math.sqrt(squares / (size - 1)) };
}
