import { probit } from "simple-statistics";
import { describe, expect, it } from "vitest";
import { AEC_Q001_IQR_DIVISOR, MAD_NORMAL_CONSISTENCY, iqrSigma, madSigma, median, quantile } from "./robust";
import { normalQuantile } from "./special-functions";

// A "perfect" standard normal sample: the N quantiles Φ⁻¹((i − ½)/N), so robust sigmas must return ≈ 1.
const normalSample = Array.from({ length: 20001 }, (_, i) => normalQuantile((i + 0.5) / 20001));

describe("quantile (Hyndman & Fan type 7)", () => {
  it("interpolates between order statistics at h = (n − 1)p, like R's default", () => {
    // [1, 2, 3, 4]: p = .25 → h = 0.75 → 1.75; p = .75 → h = 2.25 → 3.25; p = .1 → h = 0.3 → 1.3
    expect(quantile([4, 1, 3, 2], 0.25)).toBeCloseTo(1.75, 14);
    expect(quantile([4, 1, 3, 2], 0.75)).toBeCloseTo(3.25, 14);
    expect(quantile([4, 1, 3, 2], 0.1)).toBeCloseTo(1.3, 14);
  });

  it("returns the minimum at p = 0 and the maximum at p = 1", () => {
    expect(quantile([5, -2, 9], 0)).toBe(-2);
    expect(quantile([5, -2, 9], 1)).toBe(9);
  });

  it("leaves the caller's array unsorted", () => {
    const values = [3, 1, 2];
    quantile(values, 0.5);
    expect(values).toEqual([3, 1, 2]);
  });

  it("returns a single value for every p, NaN for an empty sample or one holding NaN", () => {
    expect(quantile([7], 0.3)).toBe(7);
    expect(quantile([], 0.5)).toBeNaN();
    expect(quantile([1, Number.NaN, 3], 0.5)).toBeNaN();
  });

  it("treats ±Infinity as an order statistic without turning an exact hit into NaN", () => {
    expect(quantile([1, 2, Number.POSITIVE_INFINITY], 0.5)).toBe(2);
    expect(quantile([1, 2, Number.POSITIVE_INFINITY], 1)).toBe(Number.POSITIVE_INFINITY);
  });

  it("refuses p outside [0, 1]", () => {
    expect(() => quantile([1, 2], -0.01)).toThrow(RangeError);
    expect(() => quantile([1, 2], 1.01)).toThrow(RangeError);
    expect(() => quantile([1, 2], Number.NaN)).toThrow(RangeError);
  });
});

describe("median", () => {
  it("takes the middle value for odd n and the mean of the middle two for even n", () => {
    expect(median([9, 1, 5])).toBe(5);
    expect(median([9, 1, 5, 3])).toBe(4);
  });

  it("is NaN for an empty sample", () => {
    expect(median([])).toBeNaN();
  });
});

describe("madSigma", () => {
  it("uses the normal consistency factor 1/Φ⁻¹(3/4) ≈ 1.4826", () => {
    expect(MAD_NORMAL_CONSISTENCY).toBeCloseTo(1.4826, 4);
    expect(MAD_NORMAL_CONSISTENCY).toBeCloseTo(1 / 0.6744897501960817, 12);
    // simple-statistics' probit is a closed-form approximation good to ≈ 3e-5 in z.
    expect(MAD_NORMAL_CONSISTENCY).toBeCloseTo(1 / probit(0.75), 3);
  });

  it("scales the median absolute deviation: [1, 2, 3, 4, 100] has MAD 1, so σ̂ = 1.4826 despite the outlier", () => {
    expect(madSigma([1, 2, 3, 4, 100])).toBeCloseTo(MAD_NORMAL_CONSISTENCY, 14);
  });

  it("recovers σ = 1 from a standard normal sample within 1e-3", () => {
    expect(madSigma(normalSample)).toBeCloseTo(1, 3);
    expect(madSigma(normalSample.map((z) => 5 + 0.2 * z))).toBeCloseTo(0.2, 3);
  });

  it("is 0 for one value or no spread and NaN for an empty sample", () => {
    expect(madSigma([3.5])).toBe(0);
    expect(madSigma([2, 2, 2])).toBe(0);
    expect(madSigma([])).toBeNaN();
    expect(madSigma([1, Number.NaN])).toBeNaN();
  });
});

describe("iqrSigma", () => {
  it("divides the type-7 IQR by 1.35: 1…8 has Q₁ = 2.75, Q₃ = 6.25, so σ̂ = 3.5/1.35", () => {
    expect(iqrSigma([1, 2, 3, 4, 5, 6, 7, 8])).toBeCloseTo(3.5 / 1.35, 14);
  });

  it("keeps AEC-Q001's 1.35, which is 2Φ⁻¹(3/4) = 1.349 rounded", () => {
    expect(AEC_Q001_IQR_DIVISOR).toBe(1.35);
    expect(2 * normalQuantile(0.75)).toBeCloseTo(AEC_Q001_IQR_DIVISOR, 2);
  });

  it("gives 1.349/1.35 ≈ 0.9992 on a standard normal sample", () => {
    expect(iqrSigma(normalSample)).toBeCloseTo((2 * normalQuantile(0.75)) / 1.35, 3);
  });

  it("is 0 for one value and NaN for an empty sample", () => {
    expect(iqrSigma([4])).toBe(0);
    expect(iqrSigma([])).toBeNaN();
  });
});
