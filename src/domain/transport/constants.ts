// SI 2019 exact (the defining constants of the revised SI).
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;
// SI 2019 exact
export const PLANCK_JS = 6.62607015e-34;
// SI 2019 exact
export const BOLTZMANN_JK = 1.380649e-23;

/** Conductance quantum G₀ = 2q²/h in S (spin-degenerate single mode), derived from the SI 2019 exact q and h. */
export const CONDUCTANCE_QUANTUM_S = (2 * ELEMENTARY_CHARGE_C * ELEMENTARY_CHARGE_C) / PLANCK_JS;

/** Thermal voltage kT/q in V (SI 2019 exact k, q); 0 at T = 0, NaN for a negative or non-finite temperature. */
export function thermalVoltageV(temperatureK: number): number {
  return temperatureK >= 0 && Number.isFinite(temperatureK) ? (BOLTZMANN_JK * temperatureK) / ELEMENTARY_CHARGE_C : Number.NaN;
}

/** Thermal energy kT in eV (numerically equal to kT/q in V); 0 at T = 0, NaN for a negative or non-finite temperature. */
export function thermalEnergyEv(temperatureK: number): number {
  return thermalVoltageV(temperatureK);
}
