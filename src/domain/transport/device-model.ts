import { CONDUCTANCE_QUANTUM_S, thermalEnergyEv, thermalVoltageV } from "./constants";
import { integrateAgainstThermalBroadening } from "./quadrature";

export type StepDeviceModel = { kind: "step"; modes: number; transmission: number; edgeEv: number };
/** Points are [energyEv, conductanceS], energies strictly increasing. */
export type TableDeviceModel = { kind: "table"; points: [number, number][] };
/** Conductance-function model G(E) of PRODUCT §8. */
export type DeviceModel = StepDeviceModel | TableDeviceModel;

export interface ExpectedConductance {
  conductanceS: number;
  /** G/G₀. */
  modes: number;
  warnings: string[];
}

/** Half-width of the thermal window, in kT, beyond which a table's constant extrapolation earns a warning. */
const TABLE_WARNING_WINDOW_KT = 10;

/**
 * G(E) in S for energies in eV (PRODUCT §8). Step: M·𝒯·G₀ above E_c, 0 below, half of it exactly at E_c (the T → 0
 * limit of the closed form). Table: linear interpolation between knots, constant beyond the ends. RangeError for a
 * model that is not usable (negative or non-finite modes, 𝒯 outside [0, 1], fewer than 2 points, energies not
 * strictly increasing, negative or non-finite conductance).
 */
export function conductanceFunctionS(model: DeviceModel): (energyEv: number) => number {
  assertUsableModel(model);
  if (model.kind === "step") {
    const plateauS = model.modes * model.transmission * CONDUCTANCE_QUANTUM_S;
    const edgeEv = model.edgeEv;
    return (energyEv) => (energyEv > edgeEv ? plateauS : energyEv < edgeEv ? 0 : plateauS / 2);
  }
  const energies = Float64Array.from(model.points, (p) => p[0]);
  const conductances = Float64Array.from(model.points, (p) => p[1]);
  const last = energies.length - 1;
  return (energyEv) => {
    if (energyEv <= (energies[0] as number)) return conductances[0] as number;
    if (energyEv >= (energies[last] as number)) return conductances[last] as number;
    let lo = 0;
    let hi = last;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if ((energies[mid] as number) <= energyEv) lo = mid;
      else hi = mid;
    }
    const e0 = energies[lo] as number;
    const g0 = conductances[lo] as number;
    return g0 + (((conductances[hi] as number) - g0) * (energyEv - e0)) / ((energies[hi] as number) - e0);
  };
}

/**
 * Expected linear-response G = ∫ G(E) F_T(E − μ) dE in S, and G/G₀ (PRODUCT §5, §8), by adaptive quadrature split at
 * the band edge or table knots. T = 0 gives G(μ). Warns when a table's thermal window μ ± 10 kT reaches past its
 * ends. RangeError for an unusable model, a non-finite μ or a negative or non-finite T.
 */
export function expectedConductance(model: DeviceModel, fermiLevelEv: number, temperatureK: number): ExpectedConductance {
  const conductanceS = conductanceFunctionS(model);
  if (!Number.isFinite(fermiLevelEv)) throw new RangeError(`Fermi level ${fermiLevelEv} eV is not a finite energy`);
  const breakpointsEv = model.kind === "step" ? [model.edgeEv] : model.points.map((p) => p[0]);
  const result = integrateAgainstThermalBroadening(conductanceS, fermiLevelEv, temperatureK, breakpointsEv);
  const warnings: string[] = [];
  if (model.kind === "table") {
    const halfWidthEv = TABLE_WARNING_WINDOW_KT * thermalEnergyEv(temperatureK);
    const firstEv = model.points[0]?.[0] as number;
    const lastEv = model.points[model.points.length - 1]?.[0] as number;
    if (fermiLevelEv - halfWidthEv < firstEv || fermiLevelEv + halfWidthEv > lastEv) {
      warnings.push(
        `the thermal window μ ± 10 kT (${formatEv(fermiLevelEv - halfWidthEv)} to ${formatEv(fermiLevelEv + halfWidthEv)} eV) ` +
          `reaches beyond the table (${formatEv(firstEv)} to ${formatEv(lastEv)} eV); G(E) is taken as constant beyond the ends`,
      );
    }
  }
  if (!result.converged) {
    warnings.push(`the thermal average did not converge (error estimate ${result.errorEstimate.toPrecision(2)} S)`);
  }
  return { conductanceS: result.value, modes: result.value / CONDUCTANCE_QUANTUM_S, warnings };
}

/** Suggested bias half-window V_w = w·kT/q in V (PRODUCT §5 step 1); 0 at T = 0, NaN for a negative T. */
export function suggestedWindowV(temperatureK: number, windowFactor: number): number {
  return windowFactor * thermalVoltageV(temperatureK);
}

function assertUsableModel(model: DeviceModel): void {
  if (model.kind === "step") {
    const { modes, transmission, edgeEv } = model;
    if (!(Number.isFinite(modes) && modes >= 0)) throw new RangeError(`modes ${modes} must be a finite number ≥ 0`);
    if (!(transmission >= 0 && transmission <= 1)) throw new RangeError(`transmission ${transmission} must lie in [0, 1]`);
    if (!Number.isFinite(edgeEv)) throw new RangeError(`band edge ${edgeEv} eV is not a finite energy`);
    return;
  }
  const { points } = model;
  if (points.length < 2) throw new RangeError(`a conductance table needs at least 2 points, found ${points.length}`);
  let previousEv = Number.NEGATIVE_INFINITY;
  points.forEach(([energyEv, conductanceS], i) => {
    if (!Number.isFinite(energyEv) || !Number.isFinite(conductanceS)) throw new RangeError(`point ${i + 1} is not finite`);
    if (!(energyEv > previousEv)) throw new RangeError(`point ${i + 1}: energies must strictly increase`);
    if (conductanceS < 0) throw new RangeError(`point ${i + 1}: conductance ${conductanceS} S is negative`);
    previousEv = energyEv;
  });
}

function formatEv(energyEv: number): string {
  return String(Number(energyEv.toPrecision(4)));
}
