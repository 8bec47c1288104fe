import "server-only";
import { type Kysely, sql } from "kysely";
import { edgeVersusCentre, radialZoneBounds, waferGeometry, type WaferGeometryInput, zoneYieldsFromCounts } from "@/domain/yield";
import type { Database } from "../db/schema";

// An edge ring: the edge zone yields far below the centre (§6). Thresholds (common practice): a gap of at least
// 25 percentage points, with at least 20 dies in the edge zone so a few fails on a sparse edge do not count.
export const EDGE_RING_MIN_GAP = 0.25;
export const EDGE_RING_MIN_EDGE_DIES = 20;

export interface EdgeCheck {
  wafer: number;
  edgeYield: number | null;
  centreYield: number | null;
  gap: number | null;
  edgeTested: number;
  ring: boolean;
}

interface ZoneCountRow {
  wafer_slot: number;
  centre_tested: number; centre_pass: number; middle_tested: number; middle_pass: number;
  edge_tested: number; edge_pass: number; outside_tested: number; outside_pass: number;
}

/**
 * Per wafer of the lot: centre and edge zone yields and the ring verdict. PostgreSQL counts each wafer's dies per
 * radial zone with the domain's rules (centre of the probed extents as in gridCentre, die-centre radius in mm as in
 * dieRadiusMm, the equal-area bounds of radialZoneBounds, inclusive), so no die row reaches the app: reading the
 * 500,000 dies of a large lot cost about 3 s of app CPU and 100 MB of its memory. One pass with window functions
 * for each wafer's extents, no join: right after an ingest the new dies have no statistics yet, and the join of the dies
 * with their wafers' extents planned on that ran for over a minute in bench:ingest.
 */
export async function edgeChecks(tx: Kysely<Database>, lotId: string, geometryInput: WaferGeometryInput): Promise<EdgeCheck[]> {
  const geometry = waferGeometry(geometryInput);
  const bounds = radialZoneBounds(geometry);
  const zone = (lower: number | null, upper: number | null) =>
    sql`${lower === null ? sql`true` : sql`r > ${lower}::float8`} and ${upper === null ? sql`true` : sql`r <= ${upper}::float8`}`;
  const counts = (name: string, lower: number | null, upper: number | null) =>
    sql`count(*) filter (where ${zone(lower, upper)})::int as ${sql.raw(`${name}_tested`)}, count(*) filter (where ${zone(lower, upper)} and bin = 'PASS')::int as ${sql.raw(`${name}_pass`)}`;
  const { rows } = await sql<ZoneCountRow>`
    with placed as (
      select wafer_slot, bin,
             sqrt(((x - (min(x) over w + max(x) over w)::float8 / 2) * ${geometry.dieWidthMm}::float8) ^ 2
                + ((y - (min(y) over w + max(y) over w)::float8 / 2) * ${geometry.dieHeightMm}::float8) ^ 2) as r
        from dies where lot_id = ${lotId} window w as (partition by wafer_slot)
    )
    select wafer_slot, ${counts("centre", null, bounds.centre)}, ${counts("middle", bounds.centre, bounds.middle)},
           ${counts("edge", bounds.middle, bounds.edge)}, ${counts("outside", bounds.edge, null)}
      from placed group by wafer_slot order by wafer_slot`.execute(tx);
  return rows.map((row) => {
    const tally = (name: "centre" | "middle" | "edge" | "outside") => ({ tested: row[`${name}_tested`], pass: row[`${name}_pass`] });
    const zones = zoneYieldsFromCounts({ centre: tally("centre"), middle: tally("middle"), edge: tally("edge"), outside: tally("outside") });
    const { edgeYield, centreYield, gap } = edgeVersusCentre(zones);
    const ring = gap !== null && gap >= EDGE_RING_MIN_GAP && zones.edge.tested >= EDGE_RING_MIN_EDGE_DIES;
    return { wafer: row.wafer_slot, edgeYield, centreYield, gap, edgeTested: zones.edge.tested, ring };
  });
}
