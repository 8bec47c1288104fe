// Western Electric rules (Western Electric, Statistical Quality Control Handbook, 1956) and Nelson's
// eight tests (Nelson, Journal of Quality Technology 16(4), 1984; citations from memory), on points in chart order.
//
// Every rule takes (values, center, sigma) and returns ascending indices of the points that complete
// the pattern; while a run goes on, each further point fires again. Conventions (common practice):
// "beyond kσ" is strict (a point exactly on a zone line is not beyond it) and "within 1σ" is its
// complement; a point exactly on the centre line belongs to neither side; equal neighbours break a trend
// or an alternation; a non-finite point is never beyond or within anything and breaks every run.
// For m-of-n tests the completing point is itself one of the m, and near the start a window shorter
// than n counts. When limits vary per point (X̄–S with unequal sizes) pass z-scores with centre 0, σ 1.

export type RuleSet = "western-electric" | "nelson";
export type RuleId = "WE1" | "WE2" | "WE3" | "WE4" | "N1" | "N2" | "N3" | "N4" | "N5" | "N6" | "N7" | "N8";
export type RuleCheck = (values: readonly number[], center: number, sigma: number) => number[];

export interface RuleViolation {
  readonly index: number;
  readonly rule: RuleId;
  readonly description: string;
}

/** One plain sentence per rule, for excursion titles and chart tooltips. */
export const RULE_DESCRIPTIONS: Readonly<Record<RuleId, string>> = {
  WE1: "One point beyond 3σ from the centre line.",
  WE2: "Two of three consecutive points beyond 2σ on the same side of the centre line.",
  WE3: "Four of five consecutive points beyond 1σ on the same side of the centre line.",
  WE4: "Eight consecutive points on the same side of the centre line.",
  N1: "One point beyond 3σ from the centre line.",
  N2: "Nine consecutive points on the same side of the centre line.",
  N3: "Six consecutive points steadily increasing or steadily decreasing.",
  N4: "Fourteen consecutive points alternating up and down.",
  N5: "Two of three consecutive points beyond 2σ on the same side of the centre line.",
  N6: "Four of five consecutive points beyond 1σ on the same side of the centre line.",
  N7: "Fifteen consecutive points within 1σ of the centre line, on either side.",
  N8: "Eight consecutive points beyond 1σ, on either side, none of them within 1σ.",
};

/** WE rule 1: one point beyond centre ± 3σ. */
export const westernElectricRule1: RuleCheck = (values, center, sigma) => mOfNBeyond(values, center, sigma, 3, 1, 1);
/** WE rule 2: two of three consecutive points beyond 2σ on the same side. */
export const westernElectricRule2: RuleCheck = (values, center, sigma) => mOfNBeyond(values, center, sigma, 2, 2, 3);
/** WE rule 3: four of five consecutive points beyond 1σ on the same side. */
export const westernElectricRule3: RuleCheck = (values, center, sigma) => mOfNBeyond(values, center, sigma, 1, 4, 5);
/** WE rule 4: eight consecutive points on the same side of the centre line. */
export const westernElectricRule4: RuleCheck = (values, center, sigma) => sameSideRun(values, center, sigma, 8);

/** Nelson test 1: one point beyond centre ± 3σ. */
export const nelsonRule1: RuleCheck = westernElectricRule1;
/** Nelson test 2: nine consecutive points on the same side of the centre line. */
export const nelsonRule2: RuleCheck = (values, center, sigma) => sameSideRun(values, center, sigma, 9);
/** Nelson test 3: six consecutive points each above (or each below) the one before. */
export const nelsonRule3: RuleCheck = (values, center, sigma) => {
  checkLine(center, sigma);
  const rising = runEnds(values.length, 5, (i) => i > 0 && (values[i] ?? NaN) > (values[i - 1] ?? NaN));
  const falling = runEnds(values.length, 5, (i) => i > 0 && (values[i] ?? NaN) < (values[i - 1] ?? NaN));
  return union(rising, falling);
};
/** Nelson test 4: fourteen consecutive points alternating up and down (thirteen steps, each reversing the last). */
export const nelsonRule4: RuleCheck = (values, center, sigma) => {
  checkLine(center, sigma);
  const step = (i: number) => (values[i] ?? NaN) - (values[i - 1] ?? NaN);
  const reverses = (i: number) => i > 1 && step(i) * step(i - 1) < 0;
  // A run of 12 reversals ending at i means steps i − 12 … i alternate: 13 steps, 14 points.
  return runEnds(values.length, 12, reverses);
};
/** Nelson test 5: two of three consecutive points beyond 2σ on the same side. */
export const nelsonRule5: RuleCheck = westernElectricRule2;
/** Nelson test 6: four of five consecutive points beyond 1σ on the same side. */
export const nelsonRule6: RuleCheck = westernElectricRule3;
/** Nelson test 7: fifteen consecutive points within 1σ of the centre (|x − centre| ≤ σ). */
export const nelsonRule7: RuleCheck = (values, center, sigma) => {
  checkLine(center, sigma);
  return runEnds(values.length, 15, (i) => Math.abs((values[i] ?? NaN) - center) <= sigma);
};
/** Nelson test 8: eight consecutive points beyond 1σ on either side, none within 1σ. */
export const nelsonRule8: RuleCheck = (values, center, sigma) => {
  checkLine(center, sigma);
  return runEnds(values.length, 8, (i) => Math.abs((values[i] ?? NaN) - center) > sigma);
};

const RULE_SETS: Readonly<Record<RuleSet, readonly (readonly [RuleId, RuleCheck])[]>> = {
  "western-electric": [
    ["WE1", westernElectricRule1],
    ["WE2", westernElectricRule2],
    ["WE3", westernElectricRule3],
    ["WE4", westernElectricRule4],
  ],
  nelson: [
    ["N1", nelsonRule1],
    ["N2", nelsonRule2],
    ["N3", nelsonRule3],
    ["N4", nelsonRule4],
    ["N5", nelsonRule5],
    ["N6", nelsonRule6],
    ["N7", nelsonRule7],
    ["N8", nelsonRule8],
  ],
};

/** Runs every rule of the set (WE 1–4 or Nelson 1–8) and lists the violations by point index, then rule number; RangeError for a non-finite centre or a σ not finite ≥ 0. */
export function evaluateRules(values: readonly number[], center: number, sigma: number, ruleSet: RuleSet): RuleViolation[] {
  const violations = RULE_SETS[ruleSet].flatMap(([rule, check]) =>
    check(values, center, sigma).map((index) => ({ index, rule, description: RULE_DESCRIPTIONS[rule] })),
  );
  // Array.prototype.sort is stable, so rules keep their set order within one index.
  return violations.sort((a, b) => a.index - b.index);
}

function checkLine(center: number, sigma: number): void {
  if (!Number.isFinite(center)) throw new RangeError(`rule centre must be finite, got ${center}`);
  if (!Number.isFinite(sigma) || sigma < 0) throw new RangeError(`rule sigma must be finite and ≥ 0, got ${sigma}`);
}

// Indices i where condition(i) has held for `length` consecutive indices ending at i.
function runEnds(count: number, length: number, condition: (i: number) => boolean): number[] {
  const ends: number[] = [];
  let run = 0;
  for (let i = 0; i < count; i++) {
    run = condition(i) ? run + 1 : 0;
    if (run >= length) ends.push(i);
  }
  return ends;
}

function sameSideRun(values: readonly number[], center: number, sigma: number, length: number): number[] {
  checkLine(center, sigma);
  const above = runEnds(values.length, length, (i) => (values[i] ?? NaN) > center);
  const below = runEnds(values.length, length, (i) => (values[i] ?? NaN) < center);
  return union(above, below);
}

// Point i is beyond kσ on one side and at least m of the (up to) n points ending at i are beyond on that side.
function mOfNBeyond(values: readonly number[], center: number, sigma: number, k: number, m: number, n: number): number[] {
  checkLine(center, sigma);
  const fired: number[] = [];
  for (const side of [1, -1]) {
    const beyond = (i: number) => side * ((values[i] ?? NaN) - center) > k * sigma;
    for (let i = 0; i < values.length; i++) {
      if (!beyond(i)) continue;
      let hits = 0;
      for (let j = Math.max(0, i - n + 1); j <= i; j++) if (beyond(j)) hits++;
      if (hits >= m) fired.push(i);
    }
  }
  return fired.sort((a, b) => a - b);
}

function union(a: readonly number[], b: readonly number[]): number[] {
  return [...new Set([...a, ...b])].sort((x, y) => x - y);
}
