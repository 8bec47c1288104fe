import { dieCentreMm, gridCentre, waferGeometry, type GridCentre, type GridPoint, type PointMm } from "../yield/geometry";
import type { MapGeometry } from "./map-die";

/** A die rectangle in mm on the map plane, wafer centre at the origin, y up. */
export interface DieRectMm {
  readonly centreXMm: number;
  readonly centreYMm: number;
  readonly leftMm: number;
  readonly bottomMm: number;
  readonly widthMm: number;
  readonly heightMm: number;
}

export interface MapLayout {
  /** Wafer centre in grid units (midpoint of the probed extents, as in yield/geometry). */
  readonly centre: GridCentre;
  /** One rectangle per input die, same order. */
  readonly rects: readonly DieRectMm[];
  readonly dieWidthMm: number;
  readonly dieHeightMm: number;
  /** Wafer outline radius, diameter / 2. */
  readonly waferRadiusMm: number;
  /** Outline radius minus the edge exclusion. */
  readonly usableRadiusMm: number;
  /** Notch mark at 6 o'clock: a V cut into the outline, [left point on the rim, tip inside, right point on the rim]. */
  readonly notchMm: readonly [PointMm, PointMm, PointMm];
  /** Half-side of a square view centred on the wafer that holds the outline and every die with a margin. */
  readonly viewHalfSideMm: number;
}

// Drawing choices, not trade facts: a real notch is ~1 mm deep, which vanishes on a whole-wafer map, so the
// mark is drawn at 3.5 % of the radius (at least 1 mm); the view keeps a 4 % margin round the outline.
const NOTCH_DEPTH_FRACTION = 0.035;
const VIEW_MARGIN = 1.04;

/**
 * Die rectangles in mm from grid indices: centre = ((x − cx)·dieWidthMm, (y − cy)·dieHeightMm) with (cx, cy) the
 * centre of the probed extents (yield/geometry `gridCentre`, `dieCentreMm`), each die dieWidthMm × dieHeightMm.
 * Map convention: die_y grows upward, away from the notch, which sits at the bottom (6 o'clock); die_x grows to
 * the right. No dies gives no rectangles and the centre (0, 0). RangeError on invalid geometry (`waferGeometry`).
 */
export function mapLayout(dies: readonly GridPoint[], geometry: MapGeometry): MapLayout {
  const checked = waferGeometry(geometry);
  const { dieWidthMm, dieHeightMm } = checked;
  const waferRadiusMm = checked.waferDiameterMm / 2;
  const centre = dies.length === 0 ? { x: 0, y: 0 } : gridCentre(dies);
  let reachMm = waferRadiusMm;
  const rects = dies.map(({ x, y }): DieRectMm => {
    const { xMm, yMm } = dieCentreMm(x, y, centre, checked);
    reachMm = Math.max(reachMm, Math.abs(xMm) + dieWidthMm / 2, Math.abs(yMm) + dieHeightMm / 2);
    return {
      centreXMm: xMm,
      centreYMm: yMm,
      leftMm: xMm - dieWidthMm / 2,
      bottomMm: yMm - dieHeightMm / 2,
      widthMm: dieWidthMm,
      heightMm: dieHeightMm,
    };
  });
  const notchDepthMm = Math.min(waferRadiusMm / 2, Math.max(1, NOTCH_DEPTH_FRACTION * waferRadiusMm));
  const rimYMm = -Math.sqrt(waferRadiusMm ** 2 - notchDepthMm ** 2);
  return {
    centre,
    rects,
    dieWidthMm,
    dieHeightMm,
    waferRadiusMm,
    usableRadiusMm: checked.usableRadiusMm,
    notchMm: [
      { xMm: -notchDepthMm, yMm: rimYMm },
      { xMm: 0, yMm: -waferRadiusMm + notchDepthMm },
      { xMm: notchDepthMm, yMm: rimYMm },
    ],
    viewHalfSideMm: reachMm * VIEW_MARGIN,
  };
}
