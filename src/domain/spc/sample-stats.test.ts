import { mean as referenceMean, sampleStandardDeviation as referenceSd } from "simple-statistics";
import { describe, expect, it } from "vitest";
import { assertFinite, combineGroupSummaries, mean, sampleStandardDeviation } from "./sample-stats";

describe("mean and sampleStandardDeviation", () => {
  it("give x̄ = 5 and s = √(32/7) for 2, 4, 4, 4, 5, 5, 7, 9 (n − 1 divisor)", () => {
    const values = [2, 4, 4, 4, 5, 5, 7, 9];
    expect(mean(values)).toBe(5);
    expect(sampleStandardDeviation(values)).toBeCloseTo(Math.sqrt(32 / 7), 14);
  });

  it("agree with simple-statistics and keep precision on a large offset", () => {
    const values = [1e9 + 0.1, 1e9 + 0.2, 1e9 + 0.4, 1e9 + 0.8];
    expect(mean(values)).toBeCloseTo(referenceMean(values), 6);
    expect(sampleStandardDeviation(values)).toBeCloseTo(referenceSd(values), 6);
    expect(sampleStandardDeviation(values)).toBeCloseTo(sampleStandardDeviation([0.1, 0.2, 0.4, 0.8]), 6);
  });

  it("return NaN when there is too little data", () => {
    expect(mean([])).toBeNaN();
    expect(sampleStandardDeviation([3])).toBeNaN();
  });
});

describe("assertFinite", () => {
  it("names the first non-finite entry and passes finite arrays", () => {
    expect(() => assertFinite([1, Number.POSITIVE_INFINITY], "values")).toThrow(/value 1 is Infinity/);
    expect(() => assertFinite([1, 2], "values")).not.toThrow();
  });
});

describe("combineGroupSummaries", () => {
  const summary = (values: number[]) => ({ size: values.length, mean: referenceMean(values), s: values.length > 1 ? referenceSd(values) : 0 });

  it("gives the size, mean and sd of the pooled values (checked against simple-statistics over all of them)", () => {
    const groups = [[2, 4, 4], [4, 5, 5, 7, 9], [11], [3.5, 3.25]];
    const all = groups.flat();
    const combined = combineGroupSummaries(groups.map(summary));
    expect(combined.size).toBe(all.length);
    expect(combined.mean).toBeCloseTo(referenceMean(all), 13);
    expect(combined.s).toBeCloseTo(referenceSd(all), 13);
  });

  it("keeps precision for conductance-sized values around a large common part", () => {
    const groups = [[1.2e-5 + 1e-9, 1.2e-5 + 3e-9], [1.2e-5 + 2e-9, 1.2e-5 + 5e-9, 1.2e-5 + 4e-9]];
    const combined = combineGroupSummaries(groups.map(summary));
    expect(combined.s / referenceSd(groups.flat())).toBeCloseTo(1, 10);
  });

  it("returns NaN where there are too few values", () => {
    expect(combineGroupSummaries([]).mean).toBeNaN();
    expect(combineGroupSummaries([{ size: 1, mean: 3, s: Number.NaN }])).toEqual({ size: 1, mean: 3, s: Number.NaN });
  });
});
