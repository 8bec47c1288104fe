import { describe, expect, it } from "vitest";
import { CONDUCTANCE_QUANTUM_S, stepConductanceClosedFormS, thermalEnergyEv, type StepDeviceModel, type TableDeviceModel } from "../transport";
import { curves } from "./curves";
import { DeviceModelError } from "./device-model-error";

const relErr = (x: number, ref: number) => Math.abs(x - ref) / Math.abs(ref);
const step: StepDeviceModel = { kind: "step", modes: 2, transmission: 1, edgeEv: 0.05 };
const plateauS = 2 * CONDUCTANCE_QUANTUM_S;
const temperatureK = 300;
const kT = thermalEnergyEv(temperatureK);
const fermiLevelEv = 0.04;

describe("curves: documented sizes and axes", () => {
  const plot = curves(step, fermiLevelEv, temperatureK);

  it("samples 401 energies evenly over μ ± 12 kT with μ exactly in the middle", () => {
    expect(plot.energy).toHaveLength(401);
    expect(plot.energy[200]!.energyEv).toBe(fermiLevelEv);
    expect(relErr(plot.energy[0]!.energyEv, fermiLevelEv - 12 * kT)).toBeLessThan(1e-12);
    expect(relErr(plot.energy[400]!.energyEv, fermiLevelEv + 12 * kT)).toBeLessThan(1e-12);
    const spacing = (24 * kT) / 400;
    plot.energy.slice(1).forEach((s, i) => expect(Math.abs(s.energyEv - plot.energy[i]!.energyEv - spacing)).toBeLessThan(1e-12 * kT));
  });

  it("samples expected G at 100 temperatures, 4, 8, …, 400 K", () => {
    expect(plot.temperature.map((s) => s.temperatureK)).toEqual(Array.from({ length: 100 }, (_, i) => 4 + 4 * i));
  });

  it("samples expected G at 201 Fermi levels over the band edge ± 12 kT, widened to cover μ ± 12 kT", () => {
    expect(plot.fermiLevel).toHaveLength(201);
    // μ is 10 meV below E_c, so the range runs from μ − 12 kT to E_c + 12 kT.
    expect(relErr(plot.fermiLevel[0]!.fermiLevelEv, fermiLevelEv - 12 * kT)).toBeLessThan(1e-12);
    expect(relErr(plot.fermiLevel[200]!.fermiLevelEv, step.edgeEv + 12 * kT)).toBeLessThan(1e-12);
  });

  it("honours the sample counts and temperature range given as options", () => {
    const small = curves(step, fermiLevelEv, temperatureK, { energyPoints: 11, temperaturePoints: 5, temperatureRangeK: [10, 50], fermiLevelPoints: 3 });
    expect(small.energy).toHaveLength(11);
    expect(small.energy[5]!.energyEv).toBe(fermiLevelEv);
    expect(small.temperature.map((s) => s.temperatureK)).toEqual([10, 20, 30, 40, 50]);
    expect(small.fermiLevel).toHaveLength(3);
  });
});

describe("curves: values (PRODUCT §5 F_T, §8 closed form)", () => {
  const plot = curves(step, fermiLevelEv, temperatureK);

  it("peaks F_T at 1/(4kT) at E = μ (PRODUCT §5) and symmetric about μ", () => {
    const peak = plot.energy.reduce((best, s) => (s.broadeningPerEv > best.broadeningPerEv ? s : best));
    expect(peak.energyEv).toBe(fermiLevelEv);
    expect(relErr(peak.broadeningPerEv, 1 / (4 * kT))).toBeLessThan(1e-12);
    expect(relErr(plot.energy[100]!.broadeningPerEv, plot.energy[300]!.broadeningPerEv)).toBeLessThan(1e-9);
  });

  it("gives F_T an area of tanh(6) over μ ± 12 kT (f(μ − 12kT) − f(μ + 12kT)), trapezoid rule to 1e−7", () => {
    const spacing = plot.energy[1]!.energyEv - plot.energy[0]!.energyEv;
    const area = plot.energy.reduce((sum, s, i) => sum + s.broadeningPerEv * (i === 0 || i === 400 ? spacing / 2 : spacing), 0);
    expect(Math.abs(area - Math.tanh(6))).toBeLessThan(1e-7);
  });

  it("samples G(E) of the model: M𝒯G₀ above the edge and 0 below", () => {
    for (const s of plot.energy) expect(s.conductanceS).toBe(s.energyEv > step.edgeEv ? plateauS : 0);
  });

  it("gives expected G against temperature and Fermi level equal to the §8 closed form (1e−9 relative)", () => {
    for (const s of plot.temperature) {
      expect(relErr(s.conductanceS, stepConductanceClosedFormS(step, fermiLevelEv, s.temperatureK))).toBeLessThan(1e-9);
      expect(s.modes).toBe(s.conductanceS / CONDUCTANCE_QUANTUM_S);
    }
    for (const s of plot.fermiLevel) {
      expect(relErr(s.conductanceS, stepConductanceClosedFormS(step, s.fermiLevelEv, temperatureK))).toBeLessThan(1e-9);
    }
    expect(relErr(plot.expected.conductanceS, stepConductanceClosedFormS(step, fermiLevelEv, temperatureK))).toBeLessThan(1e-9);
  });
});

describe("curves: model axis and refusals", () => {
  const table: TableDeviceModel = { kind: "table", points: [[-0.5, 0], [0, 1e-6], [0.5, 4e-6]] };

  it("spans the whole table on the model axis and for the Fermi-level curve", () => {
    const plot = curves(table, 0, temperatureK, { energyAxis: "model" });
    expect(plot.energy[0]!.energyEv).toBe(-0.5);
    expect(plot.energy[400]!.energyEv).toBe(0.5);
    expect(plot.fermiLevel[0]!.fermiLevelEv).toBe(-0.5);
    expect(plot.fermiLevel[200]!.fermiLevelEv).toBe(0.5);
    // Knot at 0 eV: G(E) = 1 µS there, and μ = 0 is the middle of the symmetric axis.
    expect(plot.energy[200]!.conductanceS).toBe(1e-6);
  });

  it("reaches a distant band edge on the model axis", () => {
    const plot = curves(step, -0.5, temperatureK, { energyAxis: "model" });
    expect(relErr(plot.energy[400]!.energyEv, step.edgeEv + 12 * kT)).toBeLessThan(1e-12);
    expect(plot.energy[400]!.conductanceS).toBe(plateauS);
  });

  it("refuses 0 K, where F_T is a delta function, and an unusable model, with the field path", () => {
    expect(() => curves(step, 0, 0)).toThrow(DeviceModelError);
    expect(() => curves(step, 0, 0)).toThrow(/above 0 K/);
    const bad = () => curves({ kind: "table", points: [[0, 1], [-1, 2]] }, 0, 300);
    expect(bad).toThrow(DeviceModelError);
    try {
      bad();
    } catch (error) {
      expect((error as DeviceModelError).path).toBe("model.points.1");
    }
  });

  it("refuses sample counts below 2 and an inverted temperature range as programming errors", () => {
    expect(() => curves(step, 0, 300, { energyPoints: 1 })).toThrow(RangeError);
    expect(() => curves(step, 0, 300, { temperatureRangeK: [400, 4] })).toThrow(RangeError);
  });
});
