import { CONDUCTANCE_QUANTUM_S, thermalEnergyEv } from "./constants";
import { fermiOccupation, logisticOccupation } from "./fermi";
import type { StepDeviceModel } from "./device-model";

/**
 * Linear-response G of a step model, M𝒯G₀/(1 + e^((E_c − μ)/kT)) in S (PRODUCT §8 closed form), overflow-free;
 * T = 0 gives M𝒯G₀ above the edge, 0 below, half at μ = E_c; NaN for a negative T.
 */
export function stepConductanceClosedFormS(model: StepDeviceModel, fermiLevelEv: number, temperatureK: number): number {
  return model.modes * model.transmission * CONDUCTANCE_QUANTUM_S * fermiOccupation(model.edgeEv, fermiLevelEv, temperatureK);
}

/**
 * Landauer current of a step model in A (PRODUCT §8 closed form): M𝒯G₀·(kT/q)·[ln(1 + e^((μ₁−E_c)/kT)) −
 * ln(1 + e^((μ₂−E_c)/kT))], μ₁,₂ = μ ± qV/2. Written as kT·log1p(expm1(qV/kT)·σ((μ₂−E_c)/kT)) for |qV| < kT so the
 * low-bias difference keeps full precision, and as a difference of stable softplus terms otherwise.
 * T = 0 gives the limit M𝒯G₀·[max(μ₁ − E_c, 0) − max(μ₂ − E_c, 0)]/q; NaN for a negative T.
 */
export function stepCurrentClosedFormA(model: StepDeviceModel, fermiLevelEv: number, biasV: number, temperatureK: number): number {
  const plateauS = model.modes * model.transmission * CONDUCTANCE_QUANTUM_S;
  const kTEv = thermalEnergyEv(temperatureK);
  // q·V/2 in eV is numerically V/2 in volts.
  const aboveEdge1Ev = fermiLevelEv + biasV / 2 - model.edgeEv;
  const aboveEdge2Ev = fermiLevelEv - biasV / 2 - model.edgeEv;
  if (kTEv === 0) return plateauS * (Math.max(aboveEdge1Ev, 0) - Math.max(aboveEdge2Ev, 0));
  const reducedBias = biasV / kTEv;
  const x2 = aboveEdge2Ev / kTEv;
  if (Math.abs(reducedBias) < 1) {
    return plateauS * kTEv * Math.log1p(Math.expm1(reducedBias) * logisticOccupation(-x2));
  }
  return plateauS * kTEv * (softplus(aboveEdge1Ev / kTEv) - softplus(x2));
}

/** ln(1 + eˣ) without overflow. */
function softplus(x: number): number {
  return Math.max(x, 0) + Math.log1p(Math.exp(-Math.abs(x)));
}
