import type { Bin } from "../yield/yield";
import type { WaferGeometryInput } from "../yield/geometry";

/** One die as the wafer map receives it: the §9 API fields it draws, values in SI base units. */
export interface MapDie {
  readonly x: number;
  readonly y: number;
  readonly conductanceS: number | null;
  readonly bin: Bin;
  readonly outOfWindow: boolean;
  readonly inked: boolean;
  /** G/G₀ as reported by the API. */
  readonly modes: number | null;
  /** Nonlinearity index η of §5 step 3. */
  readonly nonlinearity: number | null;
  readonly r2: number | null;
  readonly pointsInWindow: number;
  readonly windowV: number;
  readonly temperatureK: number;
}

/** The product geometry the map needs (§3): die size, wafer diameter and edge exclusion, all in mm. */
export type MapGeometry = WaferGeometryInput;

export type { Bin };
