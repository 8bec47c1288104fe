/** Product geometry in millimetres, plus the usable radius derived from it. */
export interface WaferGeometry {
  readonly dieWidthMm: number;
  readonly dieHeightMm: number;
  readonly waferDiameterMm: number;
  readonly edgeExclusionMm: number;
  /** Wafer radius minus the edge exclusion: the circle inside which dies count. */
  readonly usableRadiusMm: number;
}

export interface WaferGeometryInput {
  readonly dieWidthMm: number;
  readonly dieHeightMm: number;
  readonly waferDiameterMm: number;
  readonly edgeExclusionMm: number;
}

/** A die position on the probe grid (integer indices in practice). */
export interface GridPoint {
  readonly x: number;
  readonly y: number;
}

/** A point in die-index units; may fall halfway between dies. */
export interface GridCentre {
  readonly x: number;
  readonly y: number;
}

export interface PointMm {
  readonly xMm: number;
  readonly yMm: number;
}

/** Radial zones of §7; "outside" holds die centres beyond the usable radius. */
export type RadialZone = "centre" | "middle" | "edge" | "outside";

export type ZonedDie<T extends GridPoint> = T & { readonly radiusMm: number; readonly zone: RadialZone };

/** Checks the product geometry and derives usable radius R = d/2 − edge exclusion (mm); RangeError on non-positive sizes, negative exclusion or R ≤ 0. */
export function waferGeometry(input: WaferGeometryInput): WaferGeometry {
  const { dieWidthMm, dieHeightMm, waferDiameterMm, edgeExclusionMm } = input;
  for (const [name, value] of Object.entries({ dieWidthMm, dieHeightMm, waferDiameterMm })) {
    if (!Number.isFinite(value) || value <= 0) throw new RangeError(`${name} must be a positive number, got ${value}`);
  }
  if (!Number.isFinite(edgeExclusionMm) || edgeExclusionMm < 0) {
    throw new RangeError(`edgeExclusionMm must be zero or positive, got ${edgeExclusionMm}`);
  }
  const usableRadiusMm = waferDiameterMm / 2 - edgeExclusionMm;
  if (usableRadiusMm <= 0) {
    throw new RangeError(`edge exclusion ${edgeExclusionMm} mm leaves no usable wafer of diameter ${waferDiameterMm} mm`);
  }
  return { dieWidthMm, dieHeightMm, waferDiameterMm, edgeExclusionMm, usableRadiusMm };
}

/**
 * Wafer centre in grid units = midpoint of the probed extents ((min+max)/2 in x and in y).
 * Probe maps index dies from an arbitrary origin, so the wafer centre is taken as the centre of the probed
 * extents (common practice); a partly probed wafer shifts it. RangeError on no dies or non-finite indices.
 */
export function gridCentre(dies: readonly GridPoint[]): GridCentre {
  if (dies.length === 0) throw new RangeError("gridCentre needs at least one die");
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (const { x, y } of dies) {
    if (!Number.isFinite(x) || !Number.isFinite(y)) throw new RangeError(`die index (${x}, ${y}) is not finite`);
    minX = Math.min(minX, x);
    maxX = Math.max(maxX, x);
    minY = Math.min(minY, y);
    maxY = Math.max(maxY, y);
  }
  return { x: (minX + maxX) / 2, y: (minY + maxY) / 2 };
}

/** Die-centre offset from the wafer centre in mm: ((x − cx)·dieWidthMm, (y − cy)·dieHeightMm); grid axes kept as given. */
export function dieCentreMm(x: number, y: number, centre: GridCentre, geometry: WaferGeometry): PointMm {
  return { xMm: (x - centre.x) * geometry.dieWidthMm, yMm: (y - centre.y) * geometry.dieHeightMm };
}

/** Distance of the die centre from the wafer centre in mm, √(xMm² + yMm²). */
export function dieRadiusMm(x: number, y: number, centre: GridCentre, geometry: WaferGeometry): number {
  const { xMm, yMm } = dieCentreMm(x, y, centre, geometry);
  return Math.hypot(xMm, yMm);
}

/** Outer radii (mm, inclusive) of the centre, middle and edge zones: equal-area thirds of the usable disc (common practice), R/√3, R·√(2/3) and R. */
export function radialZoneBounds(geometry: WaferGeometry): { readonly centre: number; readonly middle: number; readonly edge: number } {
  const r = geometry.usableRadiusMm;
  return { centre: r / Math.sqrt(3), middle: r * Math.sqrt(2 / 3), edge: r };
}

/**
 * Zone of a die-centre radius (mm) in equal-area thirds of the usable disc (radialZoneBounds):
 * r ≤ R/√3 centre, r ≤ R·√(2/3) middle, r ≤ R edge, beyond R outside; bounds inclusive. RangeError on negative or NaN radius.
 */
export function radialZone(radiusMm: number, geometry: WaferGeometry): RadialZone {
  if (Number.isNaN(radiusMm) || radiusMm < 0) throw new RangeError(`radius must be zero or positive, got ${radiusMm}`);
  const bounds = radialZoneBounds(geometry);
  if (radiusMm <= bounds.centre) return "centre";
  if (radiusMm <= bounds.middle) return "middle";
  if (radiusMm <= bounds.edge) return "edge";
  return "outside";
}

/** Adds radiusMm and zone to every die, measured from `centre` (default gridCentre(dies)); empty input gives []. */
export function assignZones<T extends GridPoint>(
  dies: readonly T[],
  geometry: WaferGeometry,
  centre?: GridCentre,
): ZonedDie<T>[] {
  if (dies.length === 0) return [];
  const c = centre ?? gridCentre(dies);
  return dies.map((die) => {
    const radiusMm = dieRadiusMm(die.x, die.y, c, geometry);
    return { ...die, radiusMm, zone: radialZone(radiusMm, geometry) };
  });
}
