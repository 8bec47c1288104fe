import { describe, expect, it } from "vitest";
import { CONDUCTANCE_QUANTUM_S, thermalEnergyEv } from "./constants";
import type { StepDeviceModel } from "./device-model";
import { fermiOccupation } from "./fermi";
import { integrateAdaptive } from "./quadrature";
import { stepConductanceClosedFormS, stepCurrentClosedFormA } from "./step-closed-form";

// Source: PRODUCT.md §8 closed forms (Landauer linear response of a step) and the §5 Landauer current
// I = (1/q)∫ G(E)[f₁(E) − f₂(E)] dE, which the closed-form current must reproduce.
const relErr = (x: number, ref: number) => Math.abs(x - ref) / Math.abs(ref);
const step: StepDeviceModel = { kind: "step", modes: 2, transmission: 0.5, edgeEv: 0 };
const plateauS = CONDUCTANCE_QUANTUM_S;

describe("stepConductanceClosedFormS", () => {
  it("is M𝒯G₀/2 with μ at the edge and tends to M𝒯G₀ and to the activated form", () => {
    const kT = thermalEnergyEv(300);
    expect(stepConductanceClosedFormS(step, 0, 300)).toBeCloseTo(plateauS / 2, 20);
    expect(relErr(stepConductanceClosedFormS(step, 50 * kT, 300), plateauS)).toBeLessThan(1e-15);
    expect(relErr(stepConductanceClosedFormS(step, -50 * kT, 300), plateauS * Math.exp(-50))).toBeLessThan(1e-15);
    expect(stepConductanceClosedFormS(step, -5, 4)).toBe(0);
  });
});

describe("stepCurrentClosedFormA", () => {
  it("equals the Landauer integral (1/q)∫ G(E)[f₁ − f₂] dE", () => {
    const temperatureK = 77;
    const kT = thermalEnergyEv(temperatureK);
    for (const x of [-10, -2, 0, 3]) {
      for (const biasV of [1e-4, 0.003, 0.02, -0.05]) {
        const fermiLevelEv = step.edgeEv + x * kT;
        const mu1 = fermiLevelEv + biasV / 2;
        const mu2 = fermiLevelEv - biasV / 2;
        const top = Math.max(mu1, mu2) + 60 * kT;
        const landauer = integrateAdaptive(
          (e) => plateauS * (fermiOccupation(e, mu1, temperatureK) - fermiOccupation(e, mu2, temperatureK)),
          step.edgeEv,
          top,
          [mu1, mu2],
        ).value;
        expect(relErr(stepCurrentClosedFormA(step, fermiLevelEv, biasV, temperatureK), landauer)).toBeLessThan(1e-9);
      }
    }
  });

  it("has dI/dV at V → 0 equal to the closed-form G (central difference)", () => {
    for (const temperatureK of [4, 77, 300]) {
      const kT = thermalEnergyEv(temperatureK);
      const h = 1e-4 * kT;
      for (const x of [-25, -5, -1, 0, 1, 5, 25]) {
        const fermiLevelEv = step.edgeEv + x * kT;
        const slope = (stepCurrentClosedFormA(step, fermiLevelEv, h, temperatureK) - stepCurrentClosedFormA(step, fermiLevelEv, -h, temperatureK)) / (2 * h);
        expect(relErr(slope, stepConductanceClosedFormS(step, fermiLevelEv, temperatureK))).toBeLessThan(1e-8);
      }
    }
  });

  it("is odd in V and continuous where the evaluation switches form at |qV| = kT", () => {
    const kT = thermalEnergyEv(300);
    expect(stepCurrentClosedFormA(step, 0.01, -0.004, 300)).toBeCloseTo(-stepCurrentClosedFormA(step, 0.01, 0.004, 300), 20);
    const below = stepCurrentClosedFormA(step, 0.01, kT * (1 - 1e-12), 300);
    const above = stepCurrentClosedFormA(step, 0.01, kT * (1 + 1e-12), 300);
    expect(relErr(above, below)).toBeLessThan(1e-11);
  });

  it("is exactly linear, I = M𝒯G₀·V/2, with μ at the edge (softplus(d) − softplus(−d) = d)", () => {
    for (const biasV of [1e-3, 0.05, 0.3]) {
      expect(relErr(stepCurrentClosedFormA(step, step.edgeEv, biasV, 300), (plateauS * biasV) / 2)).toBeLessThan(1e-13);
    }
  });

  it("does not overflow at large bias and low temperature", () => {
    // 1 V at 4 K is ~2900 kT: the step is fully open between the contacts, I → M𝒯G₀·(μ₁ − E_c)/q.
    expect(relErr(stepCurrentClosedFormA(step, 0, 1, 4), plateauS * 0.5)).toBeLessThan(1e-12);
  });

  it("takes the T = 0 limit M𝒯G₀·[max(μ₁ − E_c, 0) − max(μ₂ − E_c, 0)]", () => {
    expect(stepCurrentClosedFormA(step, 0.01, 0.004, 0)).toBeCloseTo(plateauS * 0.004, 20);
    expect(stepCurrentClosedFormA(step, 0.001, 0.004, 0)).toBeCloseTo(plateauS * 0.003, 20);
    expect(stepCurrentClosedFormA(step, -0.01, 0.004, 0)).toBe(0);
  });
});
