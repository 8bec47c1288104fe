import { assertFinite, mean, sampleStandardDeviation } from "./sample-stats";

export interface CapabilityInput {
  /** Measured values, in the units of the spec limits (S for conductance). */
  readonly values: readonly number[];
  /** LSL, or null for an upper-only spec. */
  readonly specLow: number | null;
  /** USL, or null for a lower-only spec. */
  readonly specHigh: number | null;
  /** Within-subgroup σ̂ from the control chart (MR̄/d₂ or s̄/c₄). */
  readonly withinSigma: number;
}

export interface Capability {
  /** Null for a one-sided spec. */
  readonly cp: number | null;
  readonly cpk: number;
  /** Null for a one-sided spec. */
  readonly pp: number | null;
  readonly ppk: number;
  readonly mean: number;
  readonly withinSigma: number;
  readonly overallSigma: number;
}

/** Cp = (USL − LSL)/6σ_within, Cpk = min(USL − μ, μ − LSL)/3σ_within, Pp and Ppk the same with the overall sample sd (n − 1 divisor) (Montgomery §8.3); one-sided spec: Cp, Pp null, Cpk/Ppk from the given side; σ = 0 gives ±∞ (NaN with μ on a limit) as the formulas do; RangeError below 2 values, on a non-finite value, with no limit, LSL ≥ USL, or σ_within not finite ≥ 0. */
export function capability(input: CapabilityInput): Capability {
  const { values, specLow, specHigh, withinSigma } = input;
  if (values.length < 2) throw new RangeError(`capability needs at least 2 values, got ${values.length}`);
  assertFinite(values, "capability values");
  return capabilityFromSummary({ count: values.length, mean: mean(values), overallSigma: sampleStandardDeviation(values), specLow, specHigh, withinSigma });
}

export interface CapabilitySummaryInput {
  /** How many values the mean and the overall sd were taken over. */
  readonly count: number;
  readonly mean: number;
  /** Overall sample sd of the values (n − 1 divisor). */
  readonly overallSigma: number;
  readonly specLow: number | null;
  readonly specHigh: number | null;
  readonly withinSigma: number;
}

/** The indices of `capability` from the values' count, mean and overall sample sd (e.g. database aggregates) instead of the values; the same RangeErrors, and one for a non-finite mean or overall sd. */
export function capabilityFromSummary(input: CapabilitySummaryInput): Capability {
  const { count, mean: mu, overallSigma, specLow, specHigh, withinSigma } = input;
  if (!(count >= 2)) throw new RangeError(`capability needs at least 2 values, got ${count}`);
  if (!Number.isFinite(mu) || !Number.isFinite(overallSigma) || overallSigma < 0) throw new RangeError(`capability mean and overall sd must be finite (sd ≥ 0), got ${mu} and ${overallSigma}`);
  if (specLow === null && specHigh === null) throw new RangeError("capability needs at least one spec limit");
  if ((specLow !== null && !Number.isFinite(specLow)) || (specHigh !== null && !Number.isFinite(specHigh))) {
    throw new RangeError("spec limits must be finite or null");
  }
  if (specLow !== null && specHigh !== null && specLow >= specHigh) {
    throw new RangeError(`spec low ${specLow} must lie below spec high ${specHigh}`);
  }
  if (!Number.isFinite(withinSigma) || withinSigma < 0) {
    throw new RangeError(`within sigma must be finite and ≥ 0, got ${withinSigma}`);
  }
  const potential = (sigma: number) => (specLow !== null && specHigh !== null ? (specHigh - specLow) / (6 * sigma) : null);
  const centred = (sigma: number) => {
    const upper = specHigh === null ? Number.POSITIVE_INFINITY : (specHigh - mu) / (3 * sigma);
    const lower = specLow === null ? Number.POSITIVE_INFINITY : (mu - specLow) / (3 * sigma);
    return Math.min(upper, lower);
  };
  return {
    cp: potential(withinSigma),
    cpk: centred(withinSigma),
    pp: potential(overallSigma),
    ppk: centred(overallSigma),
    mean: mu,
    withinSigma,
    overallSigma,
  };
}
