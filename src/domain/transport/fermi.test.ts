import { describe, expect, it } from "vitest";
import { thermalEnergyEv } from "./constants";
import { fermiOccupation, thermalBroadeningFwhmEv, thermalBroadeningPerEv } from "./fermi";
import { integrateAdaptive } from "./quadrature";

// Properties of F_T = −∂f/∂E from PRODUCT.md §5: peak 1/(4kT), area 1, FWHM 2·ln(3 + 2√2)·kT ≈ 3.5255 kT.
const muEv = 0.05;
const temperatureK = 300;
const kT = thermalEnergyEv(temperatureK);
const broadening = (e: number) => thermalBroadeningPerEv(e, muEv, temperatureK);

describe("fermiOccupation", () => {
  it("is 1/2 exactly at μ and 1/(1 + e) one kT above", () => {
    expect(fermiOccupation(muEv, muEv, temperatureK)).toBe(0.5);
    expect(fermiOccupation(muEv + kT, muEv, temperatureK)).toBeCloseTo(1 / (1 + Math.E), 15);
  });

  it("satisfies f(μ + ε) + f(μ − ε) = 1", () => {
    for (const x of [0.3, 2, 17, 40]) {
      expect(fermiOccupation(muEv + x * kT, muEv, temperatureK) + fermiOccupation(muEv - x * kT, muEv, temperatureK)).toBeCloseTo(1, 15);
    }
  });

  it("does not overflow for huge arguments and keeps the tail relative accuracy", () => {
    expect(fermiOccupation(1e4, 0, 1)).toBe(0);
    expect(fermiOccupation(-1e4, 0, 1)).toBe(1);
    // 700 kT above μ: f ≈ e^(−700) ≈ 9.86e−305, still representable.
    expect(fermiOccupation(muEv + 700 * kT, muEv, temperatureK) / Math.exp(-700)).toBeCloseTo(1, 10);
  });

  it("is the step at T = 0 with 1/2 exactly at μ", () => {
    expect(fermiOccupation(0.1, 0.2, 0)).toBe(1);
    expect(fermiOccupation(0.3, 0.2, 0)).toBe(0);
    expect(fermiOccupation(0.2, 0.2, 0)).toBe(0.5);
  });

  it("returns NaN for a negative temperature", () => {
    expect(fermiOccupation(0, 0, -5)).toBeNaN();
  });
});

describe("thermalBroadeningPerEv", () => {
  it("peaks at 1/(4kT) at E = μ", () => {
    expect(broadening(muEv) * 4 * kT).toBeCloseTo(1, 15);
  });

  it("has area 1 (numerical integral over μ ± 60 kT, to 1e−9)", () => {
    const area = integrateAdaptive(broadening, muEv - 60 * kT, muEv + 60 * kT, [muEv]).value;
    expect(Math.abs(area - 1)).toBeLessThan(1e-9);
  });

  it("equals −∂f/∂E by central finite differences", () => {
    const h = 1e-4 * kT;
    for (const x of [-12, -3, -0.7, 0, 0.4, 2.5, 9]) {
      const e = muEv + x * kT;
      const derivative = -(fermiOccupation(e + h, muEv, temperatureK) - fermiOccupation(e - h, muEv, temperatureK)) / (2 * h);
      expect(Math.abs(derivative - broadening(e)) / broadening(muEv)).toBeLessThan(1e-7);
    }
  });

  it("is symmetric about μ and underflows to 0 rather than NaN far from it", () => {
    expect(broadening(muEv + 3 * kT)).toBeCloseTo(broadening(muEv - 3 * kT), 12);
    expect(thermalBroadeningPerEv(1e3, 0, 4)).toBe(0);
    expect(thermalBroadeningPerEv(-1e3, 0, 4)).toBe(0);
  });

  it("is a delta function at T = 0", () => {
    expect(thermalBroadeningPerEv(0.2, 0.2, 0)).toBe(Number.POSITIVE_INFINITY);
    expect(thermalBroadeningPerEv(0.21, 0.2, 0)).toBe(0);
  });
});

describe("thermalBroadeningFwhmEv", () => {
  it("is ≈ 3.5255 kT from the closed form", () => {
    expect(Math.abs(thermalBroadeningFwhmEv(temperatureK) / kT - 3.5255)).toBeLessThan(5e-5);
  });

  it("matches the half-maximum points located by bisection", () => {
    const halfMax = broadening(muEv) / 2;
    let lo = muEv;
    let hi = muEv + 10 * kT;
    for (let i = 0; i < 200 && hi - lo > 1e-15; i++) {
      const mid = 0.5 * (lo + hi);
      if (broadening(mid) > halfMax) lo = mid;
      else hi = mid;
    }
    // F_T is symmetric, so the full width is twice the distance from μ to the upper half-maximum point.
    expect(Math.abs((2 * (lo - muEv)) / thermalBroadeningFwhmEv(temperatureK) - 1)).toBeLessThan(1e-9);
  });

  it("is 0 at T = 0", () => {
    expect(thermalBroadeningFwhmEv(0)).toBe(0);
  });
});
