export { BIN_COLOURS, BIN_ORDER } from "./bin-colours";
export { CIVIDIS_STOPS, cividis, contrastInk, relativeLuminance } from "./cividis";
export { dieModes, dieSummaryRows, dieSummaryText, type SummaryRow } from "./die-summary";
export { hatchSegments, type SegmentPx } from "./hatch";
export { mapLayout, type DieRectMm, type MapLayout } from "./layout";
export { containsPoint, intersectRect, type RectPx } from "./rect-px";
export type { Bin, MapDie, MapGeometry } from "./map-die";
export { dieHitTest, NO_PAINT, paintDies, type MmToPx, type PaintContext, type PaintCounts, type PaintedDie } from "./paint";
export { findDie, nearestDie, stepDie, type MapDirection } from "./navigation";
export {
  conductanceTitle,
  conductanceUnit,
  conductanceUnitSymbol,
  DEFAULT_CONDUCTANCE_UNIT,
  scaleConductance,
  siemensPerUnit,
  type ConductanceUnit,
} from "./units";
export { colourScaleRange, type ValueRange } from "./value-range";
