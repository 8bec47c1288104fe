import { describe, expect, it } from "vitest";
import { capability, capabilityFromSummary } from "./capability";

describe("capability, worked textbook example", () => {
  it("reproduces Montgomery's piston-ring Cp = 1.68 (Introduction to SQC, ch. 6; from memory)", () => {
    // Inside diameter spec 74.000 ± 0.05 mm, x̿ = 74.001 mm, σ̂ = R̄/d₂ = 0.023/2.326 ≈ 0.0099 mm as printed.
    // Two values with that mean stand in for the 125 measurements, which only Pp/Ppk would need.
    const result = capability({ values: [73.991, 74.011], specLow: 73.95, specHigh: 74.05, withinSigma: 0.0099 });
    expect(result.cp).toBeCloseTo(1.68, 2);
    // Hand-computed from the same numbers: Cpk = min(0.049, 0.051)/(3·0.0099) = 1.650.
    expect(result.cpk).toBeCloseTo(0.049 / 0.0297, 10);
    expect(result.mean).toBeCloseTo(74.001, 12);
  });
});

describe("capability, hand-computed cases", () => {
  // 9, 10, 11: μ = 10, overall s = 1; within σ̂ given as 0.5.
  const values = [9, 10, 11];

  it("gives Cp = Cpk = 2 and Pp = Ppk = 1 for a centred 7–13 spec", () => {
    expect(capability({ values, specLow: 7, specHigh: 13, withinSigma: 0.5 })).toEqual({
      cp: 2,
      cpk: 2,
      pp: 1,
      ppk: 1,
      mean: 10,
      withinSigma: 0.5,
      overallSigma: 1,
    });
  });

  it("takes Cpk and Ppk from the nearer limit when the process is off centre (8–13)", () => {
    const result = capability({ values, specLow: 8, specHigh: 13, withinSigma: 0.5 });
    expect(result.cp).toBeCloseTo(5 / 3, 14);
    expect(result.cpk).toBeCloseTo(2 / 1.5, 14);
    expect(result.ppk).toBeCloseTo(2 / 3, 14);
  });

  it("goes negative when the mean sits outside the spec", () => {
    expect(capability({ values, specLow: 11, specHigh: 20, withinSigma: 0.5 }).cpk).toBeCloseTo(-1 / 1.5, 14);
  });

  it("leaves Cp and Pp null for a one-sided spec and uses the given side", () => {
    const upperOnly = capability({ values, specLow: null, specHigh: 13, withinSigma: 0.5 });
    expect(upperOnly).toMatchObject({ cp: null, pp: null, cpk: 2, ppk: 1 });
    const lowerOnly = capability({ values, specLow: 8, specHigh: null, withinSigma: 0.5 });
    expect(lowerOnly.cpk).toBeCloseTo(2 / 1.5, 14);
    expect(lowerOnly.ppk).toBeCloseTo(2 / 3, 14);
  });

  it("is unchanged when values, limits and σ are rescaled from µS to S", () => {
    const inS = capability({ values: values.map((g) => g * 1e-6), specLow: 8e-6, specHigh: 13e-6, withinSigma: 0.5e-6 });
    expect(inS.cp).toBeCloseTo(5 / 3, 10);
    expect(inS.ppk).toBeCloseTo(2 / 3, 10);
  });

  it("gives infinite Pp and Ppk when every value is the same and inside the spec", () => {
    const result = capability({ values: [10, 10], specLow: 7, specHigh: 13, withinSigma: 0.5 });
    expect(result.overallSigma).toBe(0);
    expect(result.pp).toBe(Number.POSITIVE_INFINITY);
    expect(result.ppk).toBe(Number.POSITIVE_INFINITY);
  });
});

describe("capability input checks", () => {
  const base = { values: [1, 2, 3], specLow: 0, specHigh: 4, withinSigma: 1 };

  it("refuses fewer than two values and non-finite values", () => {
    expect(() => capability({ ...base, values: [1] })).toThrow(RangeError);
    expect(() => capability({ ...base, values: [1, Number.NaN] })).toThrow(RangeError);
  });

  it("refuses a spec with no limit, crossed limits or a non-finite limit", () => {
    expect(() => capability({ ...base, specLow: null, specHigh: null })).toThrow(RangeError);
    expect(() => capability({ ...base, specLow: 4, specHigh: 4 })).toThrow(RangeError);
    expect(() => capability({ ...base, specHigh: Number.POSITIVE_INFINITY })).toThrow(RangeError);
  });

  it("refuses a negative or non-finite within σ", () => {
    expect(() => capability({ ...base, withinSigma: -1 })).toThrow(RangeError);
    expect(() => capability({ ...base, withinSigma: Number.NaN })).toThrow(RangeError);
  });
});

describe("capabilityFromSummary", () => {
  it("gives capability's indices from the count, mean and overall sd (9, 10, 11: μ = 10, s = 1)", () => {
    const fromValues = capability({ values: [9, 10, 11], specLow: 8, specHigh: 13, withinSigma: 0.5 });
    expect(capabilityFromSummary({ count: 3, mean: 10, overallSigma: 1, specLow: 8, specHigh: 13, withinSigma: 0.5 })).toEqual(fromValues);
  });

  it("refuses fewer than two values, a non-finite mean or sd, and the spec errors capability refuses", () => {
    const base = { count: 3, mean: 10, overallSigma: 1, specLow: 7, specHigh: 13, withinSigma: 0.5 };
    expect(() => capabilityFromSummary({ ...base, count: 1 })).toThrow(RangeError);
    expect(() => capabilityFromSummary({ ...base, mean: Number.NaN })).toThrow(RangeError);
    expect(() => capabilityFromSummary({ ...base, overallSigma: Number.POSITIVE_INFINITY })).toThrow(RangeError);
    expect(() => capabilityFromSummary({ ...base, specLow: 14 })).toThrow(RangeError);
    expect(() => capabilityFromSummary({ ...base, specLow: null, specHigh: null })).toThrow(RangeError);
  });
});
