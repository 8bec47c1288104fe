import type { GridPoint, RadialZone } from "./geometry";
import type { Bin } from "./yield";

export interface ZoneYield {
  readonly tested: number;
  readonly pass: number;
  /** pass / tested; null when the zone holds no die. */
  readonly yield: number | null;
}

export interface EdgeVersusCentre {
  readonly edgeYield: number | null;
  readonly centreYield: number | null;
  /** centreYield − edgeYield: positive when the edge yields worse; null when either zone is empty. */
  readonly gap: number | null;
}

export interface StackedDie extends GridPoint {
  readonly bin: Bin;
}

export interface StackedCell {
  readonly x: number;
  readonly y: number;
  /** Wafers with a die at this position. */
  readonly tested: number;
  /** Of those, wafers where the die is not PASS (NODATA included). */
  readonly fails: number;
  /** fails / tested, 0–1. */
  readonly failRate: number;
}

const ZONES: readonly RadialZone[] = ["centre", "middle", "edge", "outside"];

/** Per radial zone: tested, PASS and yield = PASS / tested (NODATA counts as tested, as in waferYield); every zone present, yield null when empty. */
export function zoneYields(dies: readonly { readonly zone: RadialZone; readonly bin: Bin }[]): Record<RadialZone, ZoneYield> {
  const tally = new Map<RadialZone, { tested: number; pass: number }>(ZONES.map((zone) => [zone, { tested: 0, pass: 0 }]));
  for (const { zone, bin } of dies) {
    const entry = tally.get(zone);
    if (entry === undefined) throw new RangeError(`unknown radial zone ${String(zone)}`);
    entry.tested++;
    if (bin === "PASS") entry.pass++;
  }
  return zoneYieldsFromCounts(Object.fromEntries(tally) as Record<RadialZone, { tested: number; pass: number }>);
}

/** zoneYields from counts already made per zone (e.g. by the database); RangeError on a negative count or more PASS than tested. */
export function zoneYieldsFromCounts(counts: Readonly<Record<RadialZone, { readonly tested: number; readonly pass: number }>>): Record<RadialZone, ZoneYield> {
  const result = (zone: RadialZone): ZoneYield => {
    const { tested, pass } = counts[zone];
    if (!(tested >= 0) || !(pass >= 0) || pass > tested) throw new RangeError(`zone ${zone}: ${pass} PASS of ${tested} tested`);
    return { tested, pass, yield: tested === 0 ? null : pass / tested };
  };
  return { centre: result("centre"), middle: result("middle"), edge: result("edge"), outside: result("outside") };
}

/**
 * Edge-zone against centre-zone yield, gap = centre − edge (the §6 "edge ring" signal; the threshold that opens
 * an excursion is the caller's). Middle and outside zones are ignored; gap null when either zone is empty.
 */
export function edgeVersusCentre(zones: Readonly<Record<RadialZone, ZoneYield>>): EdgeVersusCentre {
  const edgeYield = zones.edge.yield;
  const centreYield = zones.centre.yield;
  const gap = edgeYield === null || centreYield === null ? null : centreYield - edgeYield;
  return { edgeYield, centreYield, gap };
}

/**
 * Stacked fail map over wafers (§7): per die position, how many wafers have a die there (tested), how many of
 * those are not PASS (fails, NODATA included) and failRate = fails / tested. Cells sorted by y, then x.
 * RangeError when one wafer lists the same position twice.
 */
export function stackedFailMap(wafers: readonly (readonly StackedDie[])[]): StackedCell[] {
  const cells = new Map<string, { x: number; y: number; tested: number; fails: number }>();
  wafers.forEach((dies, waferIndex) => {
    const seen = new Set<string>();
    for (const { x, y, bin } of dies) {
      const key = `${x},${y}`;
      if (seen.has(key)) throw new RangeError(`wafer ${waferIndex} lists die (${x}, ${y}) twice`);
      seen.add(key);
      const cell = cells.get(key) ?? { x, y, tested: 0, fails: 0 };
      cell.tested++;
      if (bin !== "PASS") cell.fails++;
      cells.set(key, cell);
    }
  });
  return [...cells.values()]
    .sort((a, b) => a.y - b.y || a.x - b.x)
    .map(({ x, y, tested, fails }) => ({ x, y, tested, fails, failRate: fails / tested }));
}
