import { describe, expect, it } from "vitest";
import { normalityHint } from "./normality";
import { normalQuantile } from "./special-functions";

// Closed forms: a two-point ±a sample has S = 0, K = −2, so JB = n/6; a one-hot sample [0, …, 0, a] of n values
// has skewness (n − 2)/√(n − 1) (from the central moments, derived by hand).
describe("normalityHint (Jarque–Bera)", () => {
  it("gives S = 0, K = −2 and JB = n/6 for a symmetric two-point sample", () => {
    const values = Array.from({ length: 12 }, (_, i) => (i % 2 === 0 ? -1 : 1));
    const hint = normalityHint(values);
    expect(hint.skewness).toBeCloseTo(0, 12);
    expect(hint.excessKurtosis).toBeCloseTo(-2, 12);
    expect(hint.jarqueBera).toBeCloseTo(12 / 6, 12);
    expect(hint.pValue).toBeCloseTo(Math.exp(-1), 12);
    expect(hint.verdict).toBe("consistent with normal");
  });

  it("matches the one-hot skewness (n − 2)/√(n − 1)", () => {
    const values = [0, 0, 0, 0, 0, 0, 0, 0, 0, 5];
    expect(normalityHint(values).skewness).toBeCloseTo(8 / Math.sqrt(9), 12);
    expect(normalityHint(values).verdict).toBe("not normal-looking");
  });

  it("reads normal-score data (Φ⁻¹ of plotting positions) as consistent with normal", () => {
    const values = Array.from({ length: 200 }, (_, i) => normalQuantile((i + 0.5) / 200));
    const hint = normalityHint(values);
    expect(Math.abs(hint.skewness ?? 1)).toBeLessThan(1e-9);
    expect(hint.verdict).toBe("consistent with normal");
  });

  it("says too few values below 8, no spread for a constant sample, and refuses NaN", () => {
    expect(normalityHint([1, 2, 3]).verdict).toBe("too few values");
    expect(normalityHint([1, 2]).jarqueBera).toBeNull();
    expect(normalityHint(Array(10).fill(2)).verdict).toBe("no spread");
    expect(() => normalityHint([1, Number.NaN, 2])).toThrow(RangeError);
  });
});
