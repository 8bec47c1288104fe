import { thermalEnergyEv } from "./constants";

/** Logistic 1/(1 + eˣ) without overflow: uses e^(−x)/(1 + e^(−x)) for x ≥ 0; 1/2 exactly at x = 0. */
export function logisticOccupation(x: number): number {
  if (x >= 0) {
    const e = Math.exp(-x);
    return e / (1 + e);
  }
  return 1 / (1 + Math.exp(x));
}

/**
 * Fermi–Dirac occupation f = 1/(1 + e^((E−μ)/kT)) (dimensionless), overflow-free for any |E−μ|.
 * T = 0 gives the step (1 below μ, 0 above, exactly 1/2 at E = μ); NaN for a negative or non-finite T.
 */
export function fermiOccupation(energyEv: number, fermiLevelEv: number, temperatureK: number): number {
  const kTEv = thermalEnergyEv(temperatureK);
  const deltaEv = energyEv - fermiLevelEv;
  if (kTEv === 0) return deltaEv > 0 ? 0 : deltaEv < 0 ? 1 : 0.5;
  return logisticOccupation(deltaEv / kTEv);
}

/**
 * Thermal broadening F_T = −∂f/∂E = (1/4kT)·sech²((E−μ)/2kT) in 1/eV (PRODUCT §5), written as
 * e^(−|x|)/(kT·(1 + e^(−|x|))²) with x = (E−μ)/kT so large |E−μ| underflows to 0 instead of overflowing.
 * T = 0 is the delta function: 0 away from μ, +Infinity at E = μ; NaN for a negative or non-finite T.
 */
export function thermalBroadeningPerEv(energyEv: number, fermiLevelEv: number, temperatureK: number): number {
  const kTEv = thermalEnergyEv(temperatureK);
  const deltaEv = energyEv - fermiLevelEv;
  if (kTEv === 0) return deltaEv === 0 ? Number.POSITIVE_INFINITY : 0;
  const e = Math.exp(-Math.abs(deltaEv / kTEv));
  const onePlus = 1 + e;
  return e / (kTEv * onePlus * onePlus);
}

/** Full width at half maximum of F_T, 2·ln(3 + 2√2)·kT ≈ 3.5255 kT, in eV (PRODUCT §5); 0 at T = 0. */
export function thermalBroadeningFwhmEv(temperatureK: number): number {
  return 2 * Math.log(3 + 2 * Math.SQRT2) * thermalEnergyEv(temperatureK);
}
