import type { WaferGeometry } from "./geometry";

/**
 * Gross dies per wafer estimate N = πd²/(4A) − πd/√(2A) (common practice; the classic die-per-wafer estimate,
 * de Vries form): d wafer diameter in mm (pass d − 2·edge exclusion for the usable disc), A die area in mm².
 * Unrounded; 0 when the edge loss exceeds the area term. RangeError on non-positive or non-finite inputs.
 */
export function grossDiesPerWafer(waferDiameterMm: number, dieAreaMm2: number): number {
  if (!Number.isFinite(waferDiameterMm) || waferDiameterMm <= 0) {
    throw new RangeError(`waferDiameterMm must be a positive number, got ${waferDiameterMm}`);
  }
  if (!Number.isFinite(dieAreaMm2) || dieAreaMm2 <= 0) {
    throw new RangeError(`dieAreaMm2 must be a positive number, got ${dieAreaMm2}`);
  }
  const d = waferDiameterMm;
  const estimate = (Math.PI * d * d) / (4 * dieAreaMm2) - (Math.PI * d) / Math.sqrt(2 * dieAreaMm2);
  return Math.max(0, estimate);
}

// Allowance, in die pitches, so a corner that lands on the circle up to rounding still counts as inside.
const ROUNDING_ALLOWANCE = 1e-9;

/**
 * Number of whole dies on centres k + offset (k integer, offset 0 or ½, in pitches) that fit within a
 * half-width of `halfSpanPitches` pitches, i.e. |k + offset| + ½ ≤ halfSpan.
 */
function diesAlongSpan(halfSpanPitches: number, offset: 0 | 0.5): number {
  const t = halfSpanPitches - 0.5 + ROUNDING_ALLOWANCE;
  if (t < 0) return 0;
  return offset === 0 ? 2 * Math.floor(t) + 1 : 2 * Math.floor(t + 0.5);
}

function countForOffset(geometry: WaferGeometry, offsetX: 0 | 0.5, offsetY: 0 | 0.5): number {
  const { dieWidthMm: w, dieHeightMm: h, usableRadiusMm: r } = geometry;
  const columnReach = Math.ceil(r / w) + 1;
  let count = 0;
  for (let i = -columnReach; i <= columnReach; i++) {
    const farXMm = Math.abs((i + offsetX) * w) + w / 2;
    if (farXMm >= r) continue;
    const halfChordMm = Math.sqrt(r * r - farXMm * farXMm);
    count += diesAlongSpan(halfChordMm / h, offsetY);
  }
  return count;
}

/**
 * Exact count of whole grid dies whose four corners lie inside the usable circle (radius d/2 − edge exclusion),
 * taking the best of the four grid placements (a die centred on the wafer centre, or a grid line through it,
 * in x and in y independently). Corners on the circle count as inside.
 */
export function countDiesInside(geometry: WaferGeometry): number {
  const offsets = [0, 0.5] as const;
  let best = 0;
  for (const offsetX of offsets) {
    for (const offsetY of offsets) best = Math.max(best, countForOffset(geometry, offsetX, offsetY));
  }
  return best;
}
