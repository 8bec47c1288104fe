import { CONDUCTANCE_QUANTUM_S } from "../transport/constants";

/** Display units for conductance: siemens, microsiemens, or multiples of the conductance quantum G₀ = 2q²/h. */
export type ConductanceUnit = "S" | "µS" | "G0";

export const DEFAULT_CONDUCTANCE_UNIT: ConductanceUnit = "µS";

// Spellings a product's unit may arrive in; "µ" is the micro sign U+00B5, "μ" the Greek mu U+03BC.
const SPELLINGS: Readonly<Record<string, ConductanceUnit>> = {
  s: "S",
  siemens: "S",
  "µs": "µS",
  "μs": "µS",
  us: "µS",
  microsiemens: "µS",
  g0: "G0",
  "g₀": "G0",
  "2q^2/h": "G0",
  "2q²/h": "G0",
  "2e^2/h": "G0",
  "2e²/h": "G0",
};

/**
 * Canonical display unit from a product's unit text ("S", "uS", "µS", "μS", "G0", "2q²/h"…; case and spaces
 * ignored). Missing, empty or unrecognised text gives µS, the unit most probe results read well in.
 */
export function conductanceUnit(productUnit: string | null | undefined): ConductanceUnit {
  if (productUnit == null) return DEFAULT_CONDUCTANCE_UNIT;
  return SPELLINGS[productUnit.replace(/\s+/g, "").toLowerCase()] ?? DEFAULT_CONDUCTANCE_UNIT;
}

/** Siemens per one display unit: 1 for S, 1e-6 for µS, G₀ = 2q²/h (SI 2019 exact q, h) for G0. */
export function siemensPerUnit(unit: ConductanceUnit): number {
  if (unit === "S") return 1;
  if (unit === "µS") return 1e-6;
  return CONDUCTANCE_QUANTUM_S;
}

/** Conductance in the display unit, conductanceS / siemensPerUnit(unit); null or non-finite input gives null. */
export function scaleConductance(conductanceS: number | null | undefined, unit: ConductanceUnit): number | null {
  if (conductanceS == null || !Number.isFinite(conductanceS)) return null;
  return conductanceS / siemensPerUnit(unit);
}

/** The unit as printed beside a value: "S", "µS" or "G₀". */
export function conductanceUnitSymbol(unit: ConductanceUnit): string {
  return unit === "G0" ? "G₀" : unit;
}

/** Legend and axis title for conductance in the unit: "G (S)", "G (µS)", or "G/G₀" for quantum units. */
export function conductanceTitle(unit: ConductanceUnit): string {
  return unit === "G0" ? "G/G₀" : `G (${unit})`;
}
