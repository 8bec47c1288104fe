import { describe, expect, it } from "vitest";
import {
  BOLTZMANN_JK,
  CONDUCTANCE_QUANTUM_S,
  ELEMENTARY_CHARGE_C,
  PLANCK_JS,
  thermalEnergyEv,
  thermalVoltageV,
} from "./constants";

// Check values: PRODUCT.md §5 (SI 2019 exact constants; G₀ = 7.7480917299e−5 S; kT/q at 300 K = 25.852 mV).
describe("SI 2019 constants", () => {
  it("holds the exact defining values", () => {
    expect(ELEMENTARY_CHARGE_C).toBe(1.602176634e-19);
    expect(PLANCK_JS).toBe(6.62607015e-34);
    expect(BOLTZMANN_JK).toBe(1.380649e-23);
  });

  it("derives G₀ = 2q²/h ≈ 7.7480917299e−5 S", () => {
    expect(Math.abs(CONDUCTANCE_QUANTUM_S - 7.7480917299e-5)).toBeLessThan(1e-15);
  });
});

describe("thermalVoltageV", () => {
  it("gives kT/q = 25.852 mV at 300 K", () => {
    expect(Math.abs(thermalVoltageV(300) - 0.025852)).toBeLessThan(5e-7);
  });

  it("scales linearly with temperature and is 0 at 0 K", () => {
    expect(thermalVoltageV(77) / thermalVoltageV(300)).toBeCloseTo(77 / 300, 14);
    expect(thermalVoltageV(0)).toBe(0);
  });

  it("returns NaN for negative or non-finite temperatures", () => {
    expect(thermalVoltageV(-1)).toBeNaN();
    expect(thermalVoltageV(Number.NaN)).toBeNaN();
    expect(thermalVoltageV(Number.POSITIVE_INFINITY)).toBeNaN();
  });
});

describe("thermalEnergyEv", () => {
  it("gives kT in eV, numerically kT/q in V (≈ 8.617e−5 eV/K × T)", () => {
    expect(thermalEnergyEv(300)).toBe(thermalVoltageV(300));
    // Boltzmann constant in eV/K, k/q = 8.617333262e−5 (follows from the exact SI values).
    expect(Math.abs(thermalEnergyEv(1) - 8.617333262e-5)).toBeLessThan(1e-14);
  });
});
