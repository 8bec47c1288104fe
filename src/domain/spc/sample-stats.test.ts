import { mean as referenceMean, sampleStandardDeviation as referenceSd } from "simple-statistics";
import { describe, expect, it } from "vitest";
import { assertFinite, mean, sampleStandardDeviation } from "./sample-stats";

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
