export {
  assignZones,
  dieCentreMm,
  dieRadiusMm,
  gridCentre,
  radialZone,
  radialZoneBounds,
  waferGeometry,
  type GridCentre,
  type GridPoint,
  type PointMm,
  type RadialZone,
  type WaferGeometry,
  type WaferGeometryInput,
  type ZonedDie,
} from "./geometry";
export { countDiesInside, grossDiesPerWafer } from "./gross-dies";
export { BINS, binCounts, binPareto, medianOf, waferYield, type Bin, type ParetoEntry, type WaferYield } from "./yield";
export {
  edgeVersusCentre,
  stackedFailMap,
  zoneYields,
  zoneYieldsFromCounts,
  type EdgeVersusCentre,
  type StackedCell,
  type StackedDie,
  type ZoneYield,
} from "./spatial-yield";
export {
  DEFAULT_CLUSTER_ALPHA,
  d0Murphy,
  d0NegativeBinomial,
  d0Poisson,
  dieAreaCm2,
  fitDefectDensity,
  murphyYield,
  negativeBinomialYield,
  poissonYield,
  type DefectDensityFit,
} from "./defect-density";
