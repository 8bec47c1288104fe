import { describe, expect, it } from "vitest";
import {
  DEFAULT_CLUSTER_ALPHA,
  d0Murphy,
  d0NegativeBinomial,
  d0Poisson,
  dieAreaCm2,
  fitDefectDensity,
  murphyYield,
  negativeBinomialYield,
  poissonYield,
} from "./defect-density";

const AREAS_CM2 = [0.01, 0.25, 1, 2.3];
const DENSITIES_PER_CM2 = [0.001, 0.05, 0.4, 1, 3.7];

function expectRelativelyClose(actual: number, expected: number, tolerance: number): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

describe("dieAreaCm2", () => {
  it("converts a die in mm to cm² (100 mm² per cm²)", () => {
    expect(dieAreaCm2(10, 10)).toBe(1);
    expect(dieAreaCm2(5, 7)).toBeCloseTo(0.35, 15);
  });
});

describe("yield models", () => {
  it("gives e^(−AD₀) for Poisson", () => {
    // e^(−0.5) = 0.6065306597126334
    expect(poissonYield(1, 0.5)).toBeCloseTo(0.6065306597126334, 15);
    expect(poissonYield(0.5, 1)).toBeCloseTo(0.6065306597126334, 15);
  });

  it("gives ((1 − e^(−AD₀))/AD₀)² for Murphy, (1 − 1/e)² at AD₀ = 1", () => {
    // 1 − 1/e = 0.6321205588285577; squared = 0.3995764008937...
    expect(murphyYield(1, 1)).toBeCloseTo(0.6321205588285577 ** 2, 15);
    expect(murphyYield(2, 0.25)).toBeCloseTo(((1 - Math.exp(-0.5)) / 0.5) ** 2, 15);
  });

  it("matches Murphy to e^(−λ)·(sinh(λ/2)/(λ/2))², the identity behind Murphy ≥ Poisson", () => {
    // (1 − e^(−λ))/λ = e^(−λ/2)·sinh(λ/2)/(λ/2) and sinh(u)/u ≥ 1.
    for (const lambda of [1e-6, 0.1, 1, 4, 20]) {
      const viaSinh = Math.exp(-lambda) * (Math.sinh(lambda / 2) / (lambda / 2)) ** 2;
      expectRelativelyClose(murphyYield(lambda, 1), viaSinh, 1e-12);
    }
  });

  it("keeps Murphy's precision for tiny AD₀ (Y ≈ 1 − AD₀)", () => {
    expectRelativelyClose(1 - murphyYield(1e-9, 1), 1e-9, 1e-6);
  });

  it("reduces the negative binomial to Seeds' 1/(1 + AD₀) at α = 1", () => {
    for (const lambda of [0.01, 0.7, 5]) expectRelativelyClose(negativeBinomialYield(lambda, 1, 1), 1 / (1 + lambda), 1e-14);
  });

  it("gives every model Y = 1 at zero defect density", () => {
    expect(poissonYield(1, 0)).toBe(1);
    expect(murphyYield(1, 0)).toBe(1);
    expect(negativeBinomialYield(1, 0, 2)).toBe(1);
  });

  it("orders Poisson ≤ Murphy ≤ Seeds for the same AD₀", () => {
    for (let lambda = 1e-4; lambda < 1e3; lambda *= 1.3) {
      const poisson = poissonYield(lambda, 1);
      const murphy = murphyYield(lambda, 1);
      const seeds = negativeBinomialYield(lambda, 1, 1);
      expect(murphy).toBeGreaterThanOrEqual(poisson);
      expect(seeds).toBeGreaterThanOrEqual(murphy);
    }
  });

  it("approaches Poisson as α grows, with relative gap ≈ (AD₀)²/(2α)", () => {
    // ln NB = −α·ln(1 + λ/α) = −λ + λ²/(2α) − O(1/α²), so NB/Poisson − 1 ≈ λ²/(2α).
    const lambda = 1.5;
    const poisson = poissonYield(lambda, 1);
    let previousGap = Infinity;
    for (const alpha of [1, 10, 100, 1e3, 1e4, 1e6]) {
      const gap = negativeBinomialYield(lambda, 1, alpha) - poisson;
      expect(gap).toBeGreaterThan(0);
      expect(gap).toBeLessThan(previousGap);
      previousGap = gap;
    }
    expectRelativelyClose(negativeBinomialYield(lambda, 1, 1e6) / poisson - 1, (lambda * lambda) / 2e6, 1e-3);
    expect(negativeBinomialYield(lambda, 1, Number.POSITIVE_INFINITY)).toBe(poisson);
  });

  it("refuses negative or non-finite area and density, and α ≤ 0", () => {
    expect(() => poissonYield(-1, 0.1)).toThrow(RangeError);
    expect(() => murphyYield(1, Number.NaN)).toThrow(RangeError);
    expect(() => negativeBinomialYield(1, 0.1, 0)).toThrow(RangeError);
    expect(() => negativeBinomialYield(1, -0.1, 2)).toThrow(RangeError);
  });
});

describe("D₀ inversions", () => {
  it("round-trips every model to 1e-10 over a grid of areas and densities", () => {
    for (const areaCm2 of AREAS_CM2) {
      for (const d0 of DENSITIES_PER_CM2) {
        const label = `A = ${areaCm2} cm², D₀ = ${d0} /cm²`;
        expect(Math.abs(d0Poisson(poissonYield(areaCm2, d0), areaCm2) - d0) / d0, label).toBeLessThan(1e-10);
        expect(Math.abs(d0Murphy(murphyYield(areaCm2, d0), areaCm2) - d0) / d0, label).toBeLessThan(1e-10);
        for (const alpha of [0.5, 2, 10]) {
          const back = d0NegativeBinomial(negativeBinomialYield(areaCm2, d0, alpha), areaCm2, alpha);
          expect(Math.abs(back - d0) / d0, `${label}, α = ${alpha}`).toBeLessThan(1e-10);
        }
      }
    }
  });

  it("matches the closed forms −ln(Y)/A and α(Y^(−1/α) − 1)/A", () => {
    for (const y of [0.05, 0.5, 0.93]) {
      expectRelativelyClose(d0Poisson(y, 0.8), -Math.log(y) / 0.8, 1e-12);
      expectRelativelyClose(d0NegativeBinomial(y, 0.8, 3), (3 * (y ** (-1 / 3) - 1)) / 0.8, 1e-12);
    }
  });

  it("solves Murphy's equation so the model gives the yield back", () => {
    for (const y of [1e-12, 0.01, 0.3, 0.77, 0.999999]) {
      expectRelativelyClose(murphyYield(0.6, d0Murphy(y, 0.6)), y, 1e-12);
    }
  });

  it("needs more defects under Murphy than Poisson to reach the same yield", () => {
    for (const y of [0.1, 0.5, 0.9]) expect(d0Murphy(y, 1)).toBeGreaterThan(d0Poisson(y, 1));
  });

  it("moves the negative-binomial D₀ to the Poisson D₀ as α grows", () => {
    expectRelativelyClose(d0NegativeBinomial(0.4, 1, 1e7), d0Poisson(0.4, 1), 1e-6);
    expect(d0NegativeBinomial(0.4, 1, Number.POSITIVE_INFINITY)).toBe(d0Poisson(0.4, 1));
  });

  it("gives D₀ = 0 at Y = 1 and Infinity at Y = 0", () => {
    for (const invert of [(y: number) => d0Poisson(y, 1), (y: number) => d0Murphy(y, 1), (y: number) => d0NegativeBinomial(y, 1, 2)]) {
      expect(invert(1)).toBe(0);
      expect(invert(0)).toBe(Number.POSITIVE_INFINITY);
    }
  });

  it("refuses yields outside [0, 1], NaN and a non-positive area", () => {
    for (const bad of [-0.01, 1.01, Number.NaN]) {
      expect(() => d0Poisson(bad, 1)).toThrow(RangeError);
      expect(() => d0Murphy(bad, 1)).toThrow(RangeError);
      expect(() => d0NegativeBinomial(bad, 1, 2)).toThrow(RangeError);
    }
    expect(() => d0Poisson(0.5, 0)).toThrow(RangeError);
    expect(() => d0Murphy(0.5, -1)).toThrow(RangeError);
    expect(() => d0NegativeBinomial(0.5, 1, -2)).toThrow(RangeError);
  });
});

describe("fitDefectDensity", () => {
  it("fits each model to the mean wafer yield", () => {
    // Mean of 0.8, 0.7, 0.9 = 0.8; Poisson D₀ = −ln(0.8)/0.5 = 0.44628710262841953 /cm²
    const fit = fitDefectDensity([0.8, 0.7, 0.9], 0.5);
    expect(fit.wafers).toBe(3);
    expect(fit.meanYield).toBeCloseTo(0.8, 15);
    expect(fit.alpha).toBe(DEFAULT_CLUSTER_ALPHA);
    expect(fit.poissonD0PerCm2).toBeCloseTo(0.44628710262841953, 12);
    expectRelativelyClose(murphyYield(0.5, fit.murphyD0PerCm2), 0.8, 1e-12);
    expectRelativelyClose(negativeBinomialYield(0.5, fit.negativeBinomialD0PerCm2, DEFAULT_CLUSTER_ALPHA), 0.8, 1e-12);
  });

  it("stays finite when one wafer yielded nothing", () => {
    const fit = fitDefectDensity([0, 0.6], 1, 4);
    expect(fit.meanYield).toBe(0.3);
    expect(Number.isFinite(fit.murphyD0PerCm2)).toBe(true);
    expectRelativelyClose(negativeBinomialYield(1, fit.negativeBinomialD0PerCm2, 4), 0.3, 1e-12);
  });

  it("refuses no wafers, a yield outside [0, 1] and a non-positive area", () => {
    expect(() => fitDefectDensity([], 1)).toThrow(RangeError);
    expect(() => fitDefectDensity([0.5, 1.2], 1)).toThrow(RangeError);
    expect(() => fitDefectDensity([0.5], 0)).toThrow(RangeError);
  });
});
