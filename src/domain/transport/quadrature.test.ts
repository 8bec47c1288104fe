import { describe, expect, it } from "vitest";
import { thermalEnergyEv } from "./constants";
import { fermiOccupation, thermalBroadeningPerEv } from "./fermi";
import { integrateAdaptive, integrateAgainstThermalBroadening } from "./quadrature";

const relErr = (x: number, ref: number) => Math.abs(x - ref) / Math.abs(ref);

describe("integrateAdaptive: the G7K15 panel", () => {
  // Degree of exactness: Kronrod extension of an n-point Gauss rule, 3n + 2 for odd n (23 for K15); G7, 2n − 1 = 13.
  it("integrates xᵏ on [0, 1] exactly with one panel up to k = 23, and not at k = 26", () => {
    for (let k = 0; k <= 23; k++) {
      const one = integrateAdaptive((x) => x ** k, 0, 1, [], { maxIntervals: 1 });
      expect(relErr(one.value, 1 / (k + 1))).toBeLessThan(2e-15);
    }
    const beyond = integrateAdaptive((x) => x ** 26, 0, 1, [], { maxIntervals: 1 });
    expect(relErr(beyond.value, 1 / 27)).toBeGreaterThan(1e-13);
  });

  it("reports zero error (Gauss = Kronrod) up to degree 13 and a non-zero one at degree 14", () => {
    for (let k = 0; k <= 13; k++) {
      expect(integrateAdaptive((x) => x ** k, 0, 1, [], { maxIntervals: 1 }).errorEstimate).toBeLessThan(1e-15);
    }
    expect(integrateAdaptive((x) => x ** 14, 0, 1, [], { maxIntervals: 1 }).errorEstimate).toBeGreaterThan(1e-12);
  });
});

describe("integrateAdaptive", () => {
  it("reaches 1e-12 relative on smooth and endpoint-singular integrands", () => {
    expect(relErr(integrateAdaptive(Math.sin, 0, Math.PI).value, 2)).toBeLessThan(1e-13);
    expect(relErr(integrateAdaptive(Math.exp, 0, 1).value, Math.E - 1)).toBeLessThan(1e-13);
    const root = integrateAdaptive(Math.sqrt, 0, 1);
    expect(root.converged).toBe(true);
    expect(relErr(root.value, 2 / 3)).toBeLessThan(1e-11);
  });

  it("splits at breakpoints so a kink is integrated exactly in two panels", () => {
    const kinked = integrateAdaptive(Math.abs, -1, 2, [0], { maxIntervals: 2 });
    expect(kinked.converged).toBe(true);
    expect(relErr(kinked.value, 2.5)).toBeLessThan(1e-15);
    // Without the breakpoint two panels are not enough.
    expect(integrateAdaptive(Math.abs, -1, 2, [], { maxIntervals: 2 }).converged).toBe(false);
  });

  it("ignores breakpoints outside the interval and handles empty and reversed intervals", () => {
    expect(relErr(integrateAdaptive((x) => x * x, 0, 3, [-5, 7]).value, 9)).toBeLessThan(1e-14);
    expect(integrateAdaptive(Math.exp, 2, 2).value).toBe(0);
    expect(relErr(integrateAdaptive(Math.exp, 1, 0).value, -(Math.E - 1))).toBeLessThan(1e-13);
  });

  it("flags a non-finite integrand as not converged", () => {
    expect(integrateAdaptive(() => Number.NaN, 0, 1).converged).toBe(false);
  });
});

describe("integrateAgainstThermalBroadening", () => {
  const muEv = 0.1;
  const temperatureK = 300;
  const kT = thermalEnergyEv(temperatureK);

  it("gives the moments of F_T: area 1, mean μ, variance π²(kT)²/3 (logistic distribution)", () => {
    expect(relErr(integrateAgainstThermalBroadening(() => 1, muEv, temperatureK).value, 1)).toBeLessThan(1e-14);
    expect(relErr(integrateAgainstThermalBroadening((e) => e, muEv, temperatureK).value, muEv)).toBeLessThan(1e-12);
    const variance = integrateAgainstThermalBroadening((e) => (e - muEv) ** 2, muEv, temperatureK).value;
    expect(relErr(variance, (Math.PI ** 2 * kT * kT) / 3)).toBeLessThan(1e-10);
  });

  it("integrates a step exactly, even 30 kT above μ where a ±40 kT window would lose 4.5e−5 of it", () => {
    const edgeEv = muEv + 30 * kT;
    const step = (e: number) => (e > edgeEv ? 1 : 0);
    const exact = fermiOccupation(edgeEv, muEv, temperatureK);
    const ours = integrateAgainstThermalBroadening(step, muEv, temperatureK, [edgeEv]);
    expect(relErr(ours.value, exact)).toBeLessThan(1e-12);
    // The truncated window for comparison: F_T at 40 kT is sech²(20) ≈ 1.7e−17 of the peak, its tail mass e^(−40).
    expect(thermalBroadeningPerEv(muEv + 40 * kT, muEv, temperatureK) * 4 * kT).toBeLessThan(1.8e-17);
    const truncated = integrateAdaptive((e) => thermalBroadeningPerEv(e, muEv, temperatureK), edgeEv, muEv + 40 * kT);
    expect(relErr(truncated.value, exact)).toBeGreaterThan(4e-5);
  });

  it("treats a step below μ as exactly as one above (no loss of precision near f = 1)", () => {
    const edgeEv = muEv - 30 * kT;
    const hole = (e: number) => (e < edgeEv ? 1 : 0);
    const exact = fermiOccupation(2 * muEv - edgeEv, muEv, temperatureK); // 1 − f(E_v) by symmetry
    expect(relErr(integrateAgainstThermalBroadening(hole, muEv, temperatureK, [edgeEv]).value, exact)).toBeLessThan(1e-12);
  });

  it("returns G(μ) at T = 0, including a kink exactly at μ", () => {
    const tent = (e: number) => 1 - Math.abs(e - muEv);
    expect(integrateAgainstThermalBroadening(tent, muEv, 0, [muEv]).value).toBe(1);
  });

  it("refuses a negative temperature", () => {
    expect(() => integrateAgainstThermalBroadening(() => 1, 0, -1)).toThrow(RangeError);
  });
});
