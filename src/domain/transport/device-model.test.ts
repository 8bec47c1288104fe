import { describe, expect, it } from "vitest";
import { CONDUCTANCE_QUANTUM_S, thermalEnergyEv } from "./constants";
import { conductanceFunctionS, expectedConductance, suggestedWindowV, type StepDeviceModel, type TableDeviceModel } from "./device-model";
import { stepConductanceClosedFormS } from "./step-closed-form";

const relErr = (x: number, ref: number) => Math.abs(x - ref) / Math.abs(ref);
const step: StepDeviceModel = { kind: "step", modes: 3, transmission: 0.8, edgeEv: 0.2 };
const plateauS = 3 * 0.8 * CONDUCTANCE_QUANTUM_S;
const softplus = (x: number) => Math.max(x, 0) + Math.log1p(Math.exp(-Math.abs(x)));

describe("conductanceFunctionS", () => {
  it("is M·𝒯·G₀ above the step edge, 0 below and half of it exactly at the edge", () => {
    const g = conductanceFunctionS(step);
    expect(g(0.2001)).toBe(plateauS);
    expect(g(0.1999)).toBe(0);
    expect(g(0.2)).toBe(plateauS / 2);
  });

  it("interpolates a table linearly and holds it constant beyond the ends", () => {
    const g = conductanceFunctionS({ kind: "table", points: [[0, 1e-6], [0.1, 3e-6], [0.3, 2e-6]] });
    expect(g(0.05)).toBeCloseTo(2e-6, 18);
    expect(g(0.2)).toBeCloseTo(2.5e-6, 18);
    expect(g(0.1)).toBe(3e-6);
    expect(g(-5)).toBe(1e-6);
    expect(g(5)).toBe(2e-6);
  });

  it("refuses unusable models", () => {
    expect(() => conductanceFunctionS({ ...step, modes: -1 })).toThrow(RangeError);
    expect(() => conductanceFunctionS({ ...step, transmission: 1.2 })).toThrow(RangeError);
    expect(() => conductanceFunctionS({ ...step, edgeEv: Number.NaN })).toThrow(RangeError);
    expect(() => conductanceFunctionS({ kind: "table", points: [[0, 1]] })).toThrow(RangeError);
    expect(() => conductanceFunctionS({ kind: "table", points: [[0, 1], [0, 2]] })).toThrow(RangeError);
    expect(() => conductanceFunctionS({ kind: "table", points: [[0, 1], [1, -2]] })).toThrow(RangeError);
    expect(() => conductanceFunctionS({ kind: "table", points: [[0, 1], [1, Number.POSITIVE_INFINITY]] })).toThrow(RangeError);
  });
});

describe("expectedConductance against the §8 closed form (Landauer linear response of a step)", () => {
  it("matches M𝒯G₀/(1 + e^((E_c − μ)/kT)) to 1e−9 relative for (E_c − μ)/kT in −30…30 at 4, 77, 300, 400 K", () => {
    for (const temperatureK of [4, 77, 300, 400]) {
      const kT = thermalEnergyEv(temperatureK);
      for (let x = -30; x <= 30; x += 0.5) {
        const fermiLevelEv = step.edgeEv - x * kT;
        const closed = stepConductanceClosedFormS(step, fermiLevelEv, temperatureK);
        const result = expectedConductance(step, fermiLevelEv, temperatureK);
        expect(relErr(result.conductanceS, closed)).toBeLessThan(1e-9);
        expect(result.warnings).toEqual([]);
      }
    }
  });

  it("gives G(μ) at T → 0: the plateau above the edge, 0 below, half at the edge", () => {
    expect(expectedConductance(step, 0.201, 0).conductanceS).toBe(plateauS);
    expect(expectedConductance(step, 0.199, 0).conductanceS).toBe(0);
    expect(expectedConductance(step, 0.2, 0).conductanceS).toBe(plateauS / 2);
    // At 1 mK, 1 meV is ~1.2e4 kT: indistinguishable from the limit.
    expect(expectedConductance(step, 0.201, 1e-3).conductanceS).toBeCloseTo(plateauS, 18);
  });

  it("saturates at M𝒯G₀ when E_c ≪ μ", () => {
    const kT = thermalEnergyEv(300);
    expect(relErr(expectedConductance(step, step.edgeEv + 40 * kT, 300).conductanceS, plateauS)).toBeLessThan(1e-12);
  });

  it("follows the activated form M𝒯G₀·e^(−(E_c − μ)/kT) when E_c ≫ μ (1e−6 relative at 20 kT)", () => {
    const kT = thermalEnergyEv(300);
    const activated = plateauS * Math.exp(-20);
    expect(relErr(expectedConductance(step, step.edgeEv - 20 * kT, 300).conductanceS, activated)).toBeLessThan(1e-6);
  });

  it("reports G in units of G₀", () => {
    const result = expectedConductance(step, 2, 300); // 69 kT above the edge: the plateau
    expect(result.modes).toBeCloseTo(2.4, 12);
    expect(result.modes).toBe(result.conductanceS / CONDUCTANCE_QUANTUM_S);
  });
});

describe("expectedConductance of a table", () => {
  const temperatureK = 77;
  const kT = thermalEnergyEv(temperatureK);
  // Knots at E_c + (i + ½)h: the table ramps linearly from 0 to M𝒯G₀ over [E_c − h/2, E_c + h/2].
  function sampledStep(fermiLevelEv: number, spacingEv: number): TableDeviceModel {
    const g = conductanceFunctionS(step);
    const fromEv = Math.min(fermiLevelEv, step.edgeEv) - 25 * kT;
    const toEv = Math.max(fermiLevelEv, step.edgeEv) + 25 * kT;
    const points: [number, number][] = [];
    for (let i = Math.floor((fromEv - step.edgeEv) / spacingEv); step.edgeEv + (i + 0.5) * spacingEv <= toEv; i++) {
      const energyEv = step.edgeEv + (i + 0.5) * spacingEv;
      points.push([energyEv, g(energyEv)]);
    }
    return { kind: "table", points };
  }

  it("integrates the sampled ramp exactly: (M𝒯G₀ kT/h)·[ln(1+e^((μ−a)/kT)) − ln(1+e^((μ−b)/kT))] to 1e−9", () => {
    // ∫ G F_T dE = ∫ G′(E) f(E) dE by parts, and G′ = M𝒯G₀/h on [a, b] = [E_c − h/2, E_c + h/2].
    const spacingEv = kT / 20;
    for (const x of [-12, -3, -0.2, 0, 1, 5, 15]) {
      const fermiLevelEv = step.edgeEv - x * kT;
      const a = step.edgeEv - spacingEv / 2;
      const b = step.edgeEv + spacingEv / 2;
      const exact = ((plateauS * kT) / spacingEv) * (softplus((fermiLevelEv - a) / kT) - softplus((fermiLevelEv - b) / kT));
      const result = expectedConductance(sampledStep(fermiLevelEv, spacingEv), fermiLevelEv, temperatureK);
      expect(relErr(result.conductanceS, exact)).toBeLessThan(1e-9);
      expect(result.warnings).toEqual([]);
    }
  });

  it("reproduces the step closed form within M𝒯G₀·(h/kT)²/200 for knot spacing h", () => {
    // Replacing the jump by a ramp of width h changes G by −M𝒯G₀·F_T′·h²/24 + O(h⁴), and |F_T′| ≤ 1/(6√3 kT²)
    // (reached at (E − μ)/kT = ±ln(2 + √3) ≈ ±1.317, hence the ±1.3 points),
    // so |ΔG| ≲ M𝒯G₀·(h/kT)²/249; 1/200 leaves room for the O(h⁴) term.
    for (const spacingKt of [0.5, 0.1, 0.02]) {
      const spacingEv = spacingKt * kT;
      for (const x of [-8, -2, -1.3, -1, 0, 1, 1.3, 2, 8]) {
        const fermiLevelEv = step.edgeEv - x * kT;
        const table = expectedConductance(sampledStep(fermiLevelEv, spacingEv), fermiLevelEv, temperatureK).conductanceS;
        const closed = stepConductanceClosedFormS(step, fermiLevelEv, temperatureK);
        expect(Math.abs(table - closed)).toBeLessThan((plateauS * spacingKt * spacingKt) / 200);
      }
    }
  });

  it("returns the interpolated G(μ) at T = 0, exactly the knot value on a knot", () => {
    const table: TableDeviceModel = { kind: "table", points: [[0, 1e-6], [0.1, 3e-6], [0.3, 2e-6]] };
    expect(expectedConductance(table, 0.1, 0).conductanceS).toBe(3e-6);
    expect(expectedConductance(table, 0.2, 0).conductanceS).toBeCloseTo(2.5e-6, 18);
  });

  it("warns that G(E) is constant beyond the ends when μ ± 10 kT leaves the table", () => {
    const table: TableDeviceModel = { kind: "table", points: [[0, 1e-6], [0.1, 3e-6], [0.3, 2e-6]] };
    const inside = expectedConductance(table, 0.15, 77);
    expect(inside.warnings).toEqual([]);
    const nearEnd = expectedConductance(table, 0.29, 77);
    expect(nearEnd.warnings).toHaveLength(1);
    expect(nearEnd.warnings[0]).toContain("constant beyond the ends");
    expect(expectedConductance(table, 0.5, 0).warnings[0]).toContain("constant beyond the ends");
    expect(expectedConductance(table, 0.3, 0).warnings).toEqual([]);
  });

  it("refuses a non-finite Fermi level and a negative temperature", () => {
    expect(() => expectedConductance(step, Number.NaN, 300)).toThrow(RangeError);
    expect(() => expectedConductance(step, 0.1, -1)).toThrow(RangeError);
  });
});

describe("suggestedWindowV", () => {
  it("is w·kT/q: ±12.93 mV at 300 K with w = 0.5 (PRODUCT §5) and 3.32 mV at 77 K", () => {
    expect(Math.abs(suggestedWindowV(300, 0.5) - 0.012926)).toBeLessThan(1e-6);
    expect(Math.abs(suggestedWindowV(77, 0.5) - 0.0033177)).toBeLessThan(1e-6);
  });
});
