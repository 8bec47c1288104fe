import { errorFunction, gammaln } from "simple-statistics";
import { describe, expect, it } from "vitest";
import { erfc, lnGamma, normalCdf, normalPdf, normalQuantile } from "./special-functions";

function factorial(n: number): number {
  let product = 1;
  for (let i = 2; i <= n; i++) product *= i;
  return product;
}

describe("lnGamma", () => {
  it("matches ln((n − 1)!) at the integers to 1e-13 relative", () => {
    for (let n = 1; n <= 25; n++) {
      const expected = Math.log(factorial(n - 1));
      expect(Math.abs(lnGamma(n) - expected)).toBeLessThanOrEqual(1e-13 * Math.max(1, Math.abs(expected)));
    }
  });

  it("matches Γ(n + ½) = (2n)!√π/(4ⁿn!) at the half-integers, including Γ(½) = √π", () => {
    for (let n = 0; n <= 12; n++) {
      const expected = Math.log((factorial(2 * n) * Math.sqrt(Math.PI)) / (4 ** n * factorial(n)));
      expect(lnGamma(n + 0.5)).toBeCloseTo(expected, 12);
    }
  });

  it("uses the reflection formula below ½: Γ(¼) = 3.6256099082219083 (published constant, from memory)", () => {
    expect(Math.exp(lnGamma(0.25))).toBeCloseTo(3.6256099082219083, 12);
  });

  it("agrees with simple-statistics' independent Lanczos gammaln to 1e-12 on 0.1…200", () => {
    for (let x = 0.1; x < 200; x *= 1.37) expect(lnGamma(x)).toBeCloseTo(gammaln(x), 10);
  });

  it("refuses zero, negative and non-finite arguments", () => {
    expect(() => lnGamma(0)).toThrow(RangeError);
    expect(() => lnGamma(-1.5)).toThrow(RangeError);
    expect(() => lnGamma(Number.NaN)).toThrow(RangeError);
  });
});

describe("erfc", () => {
  // Reference values: Abramowitz & Stegun Table 7.1 / standard tables, quoted to full double precision from memory.
  it("reproduces tabulated erf and erfc values to 1e-14 relative", () => {
    const cases: [number, number][] = [
      [0.5, 1 - 0.5204998778130465],
      [1, 1 - 0.8427007929497149],
      [2, 1 - 0.9953222650189527],
      [3, 2.209049699858544e-5],
      [5, 1.5374597944280349e-12],
    ];
    for (const [x, expected] of cases) expect(Math.abs(erfc(x) / expected - 1)).toBeLessThan(1e-13);
  });

  it("joins the series and the continued fraction smoothly at |x| = 2.5", () => {
    const below = erfc(2.5 - 1e-9);
    const above = erfc(2.5 + 1e-9);
    // The slope there is −(2/√π)e^(−6.25) ≈ −2.17e−3, so the two sides differ by ≈ 4.3e−12.
    expect(below - above).toBeCloseTo(2e-9 * (2 / Math.sqrt(Math.PI)) * Math.exp(-6.25), 15);
  });

  it("satisfies erfc(−x) = 2 − erfc(x) and the limits 0, 1, 2", () => {
    for (const x of [0.3, 1.7, 4.2]) expect(erfc(-x)).toBeCloseTo(2 - erfc(x), 15);
    expect(erfc(0)).toBe(1);
    expect(erfc(Number.POSITIVE_INFINITY)).toBe(0);
    expect(erfc(Number.NEGATIVE_INFINITY)).toBe(2);
    expect(erfc(Number.NaN)).toBeNaN();
  });

  it("stays within simple-statistics' 1.2e-7 Chebyshev erf approximation over −4…4", () => {
    for (let x = -4; x <= 4; x += 0.125) expect(Math.abs(1 - erfc(x) - errorFunction(x))).toBeLessThan(2e-7);
  });
});

describe("normalCdf and normalPdf", () => {
  it("reproduces standard normal table values (from memory) to 1e-14", () => {
    expect(normalCdf(-1)).toBeCloseTo(0.15865525393145707, 14);
    expect(normalCdf(1.96)).toBeCloseTo(0.9750021048517795, 14);
    expect(normalCdf(-3)).toBeCloseTo(0.0013498980316300946, 15);
    expect(normalCdf(0)).toBe(0.5);
  });

  it("keeps relative accuracy deep in the lower tail: Φ(−10) = 7.619853024160527e−24 (from memory)", () => {
    expect(Math.abs(normalCdf(-10) / 7.619853024160527e-24 - 1)).toBeLessThan(1e-12);
  });

  it("gives the density 1/√(2π) at 0 and e^(−1/2)/√(2π) at ±1", () => {
    expect(normalPdf(0)).toBeCloseTo(1 / Math.sqrt(2 * Math.PI), 15);
    expect(normalPdf(-1)).toBeCloseTo(Math.exp(-0.5) / Math.sqrt(2 * Math.PI), 15);
  });
});

describe("normalQuantile", () => {
  it("reproduces the familiar quantiles z(0.75), z(0.975), z(0.995) to 1e-13 (from memory)", () => {
    expect(normalQuantile(0.75)).toBeCloseTo(0.6744897501960817, 13);
    expect(normalQuantile(0.975)).toBeCloseTo(1.959963984540054, 13);
    expect(normalQuantile(0.995)).toBeCloseTo(2.5758293035489004, 13);
    expect(normalQuantile(0.5)).toBeCloseTo(0, 15);
  });

  it("inverts normalCdf from 1e−300 to 1 − 1e−12 to 1e−12 relative", () => {
    for (const p of [1e-300, 1e-50, 1e-9, 0.001, 0.2, 0.5, 0.8, 0.999, 1 - 1e-12]) {
      // Compare in the smaller tail, where both sides are free of cancellation: Φ(−x) = 1 − p above ½.
      const x = normalQuantile(p);
      const [tail, back] = p <= 0.5 ? [p, normalCdf(x)] : [1 - p, normalCdf(-x)];
      expect(Math.abs(back / tail - 1)).toBeLessThan(1e-12);
    }
  });

  it("is antisymmetric about ½ and infinite at 0 and 1", () => {
    expect(normalQuantile(0.1)).toBeCloseTo(-normalQuantile(0.9), 14);
    expect(normalQuantile(0)).toBe(Number.NEGATIVE_INFINITY);
    expect(normalQuantile(1)).toBe(Number.POSITIVE_INFINITY);
  });

  it("refuses probabilities outside [0, 1] and NaN", () => {
    expect(() => normalQuantile(-0.1)).toThrow(RangeError);
    expect(() => normalQuantile(1.5)).toThrow(RangeError);
    expect(() => normalQuantile(Number.NaN)).toThrow(RangeError);
  });
});
