import { describe, expect, it } from "vitest";
import { capability, evaluateRules, isOutOfWindow, limitSetFromBaseline, patDieWindow, xbarSLimits } from "./index";

// End to end through the public entry point: freeze limits from a baseline, judge new wafers and a new lot.
const uS = 1e-6;
const baselineMediansUs = [
  [10.0, 10.4, 9.8],
  [10.2, 9.9, 10.1],
  [10.3, 9.7, 10.0],
];
const baseline = baselineMediansUs.map((lot) => lot.map((g) => ({ medianConductanceS: g * uS, yieldFraction: 0.9 })));

describe("spc public API", () => {
  const limits = limitSetFromBaseline(baseline).waferMedianConductanceS;

  it("flags a new wafer 4σ above the frozen centre with Western Electric rule 1 at its index", () => {
    const { center, sigma } = limits.individuals;
    const newWafers = [center, center + 0.5 * sigma, center - 0.5 * sigma, center + 4 * sigma];
    expect(evaluateRules(newWafers, center, sigma, "western-electric").map((v) => [v.index, v.rule])).toEqual([[3, "WE1"]]);
  });

  it("judges a new lot of a different size against limits for that size", () => {
    const lot = limits.lotXbarS;
    if (lot === null) throw new Error("expected X̄–S limits");
    const twoWafers = xbarSLimits(lot.center, lot.sBar, 2);
    expect(twoWafers.ucl - lot.center).toBeGreaterThan(lot.ucl - lot.center);
  });

  it("rates capability against the spec with the frozen within σ", () => {
    const values = baselineMediansUs.flat().map((g) => g * uS);
    const result = capability({ values, specLow: 9 * uS, specHigh: 11 * uS, withinSigma: limits.individuals.sigma });
    expect(result.cp).toBeCloseTo((2 * uS) / (6 * limits.individuals.sigma), 10);
    expect(result.pp).toBeCloseTo((2 * uS) / (6 * result.overallSigma), 10);
  });

  it("flags a die far outside its wafer's PAT window", () => {
    const window = patDieWindow([10, 10.1, 9.9, 10.2, 9.8, 10.05].map((g) => g * uS));
    if (window === null) throw new Error("expected a window");
    expect(isOutOfWindow(14 * uS, window)).toBe(true);
    expect(isOutOfWindow(10.3 * uS, window)).toBe(false);
  });
});
