import { describe, expect, it } from "vitest";
import { CONDUCTANCE_QUANTUM_S, stepConductanceClosedFormS, thermalEnergyEv, type StepDeviceModel, type TableDeviceModel } from "../transport";
import { DeviceModelError } from "./device-model-error";
import { evaluateDeviceModel, expectedShift, type EvaluationRequest } from "./evaluate";

const relErr = (x: number, ref: number) => Math.abs(x - ref) / Math.abs(ref);
const step: StepDeviceModel = { kind: "step", modes: 4, transmission: 0.9, edgeEv: 0.1 };
const plateauS = 4 * 0.9 * CONDUCTANCE_QUANTUM_S;

function refusal(run: () => unknown): DeviceModelError {
  try {
    run();
  } catch (error) {
    if (error instanceof DeviceModelError) return error;
    throw error;
  }
  throw new Error("the input was accepted");
}

function evaluate(request: Partial<EvaluationRequest>) {
  return evaluateDeviceModel({ model: step, fermiLevelEv: 0.1, temperaturesK: [300], ...request });
}

describe("evaluateDeviceModel of a step (PRODUCT §8 closed form G = M𝒯G₀/(1 + e^((E_c − μ)/kT)))", () => {
  it("matches the closed form to 1e−9 relative at 4, 77, 150, 300, 400 and 1000 K for μ from 20 kT below to 20 kT above E_c", () => {
    for (const temperatureK of [4, 77, 150, 300, 400, 1000]) {
      const kT = thermalEnergyEv(temperatureK);
      for (const x of [-20, -5, -1, 0, 0.5, 3, 20]) {
        const fermiLevelEv = step.edgeEv + x * kT;
        const [result] = evaluate({ fermiLevelEv, temperaturesK: [temperatureK] }).results;
        expect(relErr(result!.conductanceS, stepConductanceClosedFormS(step, fermiLevelEv, temperatureK))).toBeLessThan(1e-9);
        expect(result!.modes).toBe(result!.conductanceS / CONDUCTANCE_QUANTUM_S);
        expect(result!.warnings).toEqual([]);
      }
    }
  });

  it("answers every temperature in the order given, echoing μ and T", () => {
    const evaluation = evaluate({ fermiLevelEv: 0.08, temperaturesK: [400, 4, 300] });
    expect(evaluation.fermiLevelEv).toBe(0.08);
    expect(evaluation.results.map((r) => r.temperatureK)).toEqual([400, 4, 300]);
    expect(evaluation.results[0]!.conductanceS).toBeGreaterThan(evaluation.results[2]!.conductanceS);
  });

  it("gives G(μ) at T → 0: M𝒯G₀ above the edge, 0 below, M𝒯G₀/2 at it, with a 0 V window", () => {
    const atZeroK = (fermiLevelEv: number) => evaluate({ fermiLevelEv, temperaturesK: [0] }).results[0]!;
    const [above, below, at] = [atZeroK(0.1001), atZeroK(0.0999), atZeroK(0.1)];
    expect(above.conductanceS).toBe(plateauS);
    expect(below.conductanceS).toBe(0);
    expect(at.conductanceS).toBe(plateauS / 2);
    expect(above.windowV).toBe(0);
    // At 10 mK, 0.1 meV above the edge is ~116 kT: the limit to 1e−15.
    expect(relErr(evaluate({ fermiLevelEv: 0.1001, temperaturesK: [0.01] }).results[0]!.conductanceS, plateauS)).toBeLessThan(1e-15);
  });

  it("saturates at M𝒯G₀ (3.6 G₀) when E_c ≪ μ", () => {
    const [result] = evaluate({ fermiLevelEv: step.edgeEv + 1, temperaturesK: [300] }).results; // ~39 kT
    expect(relErr(result!.conductanceS, plateauS)).toBeLessThan(1e-15);
    expect(result!.modes).toBeCloseTo(3.6, 12);
  });

  it("is activated, M𝒯G₀·e^(−(E_c − μ)/kT), when E_c ≫ μ (1e−6 relative at 15 and 25 kT below the edge)", () => {
    for (const x of [15, 25]) {
      const kT = thermalEnergyEv(77);
      const [result] = evaluate({ fermiLevelEv: step.edgeEv - x * kT, temperaturesK: [77] }).results;
      expect(relErr(result!.conductanceS, plateauS * Math.exp(-x))).toBeLessThan(1e-6);
    }
  });

  it("suggests the window w·kT/q: ±12.93 mV at 300 K with the default w = 0.5 (PRODUCT §5) and 25.85 mV with w = 1", () => {
    expect(Math.abs(evaluate({}).results[0]!.windowV - 0.012926)).toBeLessThan(1e-6);
    expect(Math.abs(evaluate({ windowFactor: 1 }).results[0]!.windowV - 0.025852)).toBeLessThan(1e-6);
  });
});

describe("evaluateDeviceModel of a table", () => {
  const temperatureK = 300;
  const kT = thermalEnergyEv(temperatureK);
  // The step sampled at knots E_c + (i + ½)h over E_c ± 40 kT: a ramp of width h replaces the jump.
  function sampledStep(spacingEv: number): TableDeviceModel {
    const count = Math.ceil((40 * kT) / spacingEv);
    const points: [number, number][] = [];
    for (let i = -count; i < count; i++) points.push([step.edgeEv + (i + 0.5) * spacingEv, i >= 0 ? plateauS : 0]);
    return { kind: "table", points };
  }

  it("of a sampled step reproduces the §8 closed form within M𝒯G₀·(h/kT)²/200", () => {
    // Bound from the ramp correction −M𝒯G₀·F_T′·h²/24 with |F_T′| ≤ 1/(6√3 kT²), as in transport/device-model.test.ts.
    for (const spacingKt of [0.2, 0.05]) {
      const table = sampledStep(spacingKt * kT);
      for (const x of [-10, -1.3, 0, 1.3, 10]) {
        const fermiLevelEv = step.edgeEv + x * kT;
        const [result] = evaluateDeviceModel({ model: table, fermiLevelEv, temperaturesK: [temperatureK] }).results;
        const closedS = stepConductanceClosedFormS(step, fermiLevelEv, temperatureK);
        expect(Math.abs(result!.conductanceS - closedS)).toBeLessThan((plateauS * spacingKt * spacingKt) / 200);
        expect(result!.warnings).toEqual([]);
      }
    }
  });

  it("passes on the warning when μ ± 10 kT reaches past the table", () => {
    const table: TableDeviceModel = { kind: "table", points: [[0, 1e-6], [0.1, 3e-6]] };
    const [result] = evaluateDeviceModel({ model: table, fermiLevelEv: 0.09, temperaturesK: [300] }).results;
    expect(result!.warnings).toHaveLength(1);
    expect(result!.warnings[0]).toContain("constant beyond the ends");
  });
});

describe("evaluateDeviceModel refusals as DeviceModelError with the field path", () => {
  it("names the table point whose energy does not increase, 0-based like a zod path", () => {
    const error = refusal(() => evaluate({ model: { kind: "table", points: [[0, 1e-6], [0.1, 2e-6], [0.1, 3e-6]] } }));
    expect(error.path).toBe("model.points.2");
    expect(error.message).toContain("strictly increase");
    expect(refusal(() => evaluate({ model: { kind: "table", points: [[0, 1e-6], [0.1, -2e-6]] } })).path).toBe("model.points.1");
    expect(refusal(() => evaluate({ model: { kind: "table", points: [[0, 1e-6]] } })).path).toBe("model.points");
  });

  it("names the step field that is out of range", () => {
    expect(refusal(() => evaluate({ model: { ...step, modes: -1 } })).path).toBe("model.modes");
    expect(refusal(() => evaluate({ model: { ...step, transmission: 1.5 } })).path).toBe("model.transmission");
    expect(refusal(() => evaluate({ model: { ...step, edgeEv: Number.POSITIVE_INFINITY } })).path).toBe("model.edgeEv");
  });

  it("names the Fermi level, the bad temperature by index and the window factor", () => {
    expect(refusal(() => evaluate({ fermiLevelEv: Number.NaN })).path).toBe("fermiLevelEv");
    expect(refusal(() => evaluate({ temperaturesK: [300, -1, 4] })).path).toBe("temperaturesK.1");
    expect(refusal(() => evaluate({ temperaturesK: [Number.POSITIVE_INFINITY] })).path).toBe("temperaturesK.0");
    expect(refusal(() => evaluate({ windowFactor: 0 })).path).toBe("windowFactor");
  });
});

describe("expectedShift (a lot probed at another chuck temperature)", () => {
  // By hand, E_c − μ = 0.1 eV, 300 → 350 K: kT = 25.852 and 30.161 meV (PRODUCT §5 check value × 350/300), so
  // (E_c − μ)/kT = 3.8682 and 3.3156, e^x = 47.85 and 27.54, G(350)/G(300) = 48.85/28.54 = 1.7117: about +71.2 %.
  it("rises by about 71.2 % when an activated step is warmed from 300 to 350 K", () => {
    const shift = expectedShift(step, step.edgeEv - 0.1, 300, 350);
    expect(Math.abs(shift.relativeChange! - 0.712)).toBeLessThan(1e-3);
    expect(shift.from.temperatureK).toBe(300);
    expect(shift.to.temperatureK).toBe(350);
    expect(shift.to.conductanceS / shift.from.conductanceS - 1).toBe(shift.relativeChange);
  });

  // By hand, μ − E_c = 0.1 eV: e^(−x) = 0.020897 and 0.036313, G(350)/G(300) = 1.020897/1.036313 = 0.985124: −1.4876 %.
  it("falls by about 1.49 % when an open step is warmed from 300 to 350 K", () => {
    const shift = expectedShift(step, step.edgeEv + 0.1, 300, 350);
    expect(Math.abs(shift.relativeChange! + 0.014876)).toBeLessThan(2e-6);
  });

  it("is 0 with μ at the edge, where G = M𝒯G₀/2 at any T > 0", () => {
    expect(Math.abs(expectedShift(step, step.edgeEv, 77, 300).relativeChange!)).toBeLessThan(1e-12);
  });

  it("has no relative change from a zero conductance, and names the bad temperature", () => {
    const shift = expectedShift(step, step.edgeEv - 0.05, 0, 300);
    expect(shift.from.conductanceS).toBe(0);
    expect(shift.to.conductanceS).toBeGreaterThan(0);
    expect(shift.relativeChange).toBeNull();
    expect(refusal(() => expectedShift(step, 0, 300, -4)).path).toBe("toK");
    expect(refusal(() => expectedShift(step, 0, Number.NaN, 300)).path).toBe("fromK");
  });
});
