import "server-only";
import { type Kysely, sql } from "kysely";
import { edgeVersusCentre, type RadialZone, radialZoneBounds, waferGeometry, type WaferGeometryInput, zoneYieldsFromCounts } from "@/domain/yield";
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

/**
 * Per wafer of the lot: centre and edge zone yields and the ring verdict. PostgreSQL places each die in its radial
 * zone with the domain's rules (centre of the probed extents as in gridCentre, die-centre radius in mm as in
 * dieRadiusMm, the inclusive bounds of radialZoneBounds as in radialZone) and counts tested and PASS dies per wafer
 * and zone, so no die row reaches the app: judging a 500,000-die lot from its dies in the app (this check and the
 * capability) took about 3 s of app CPU and raised its RSS by up to 300 MB. One pass with window functions for each
 * wafer's extents, no join: right after an ingest the new dies have no statistics yet, and the join of the dies with
 * their wafers' extents planned on that ran for over a minute in bench:ingest.
 */
export async function edgeChecks(tx: Kysely<Database>, lotId: string, geometryInput: WaferGeometryInput): Promise<EdgeCheck[]> {
  const geometry = waferGeometry(geometryInput);
  const bounds = radialZoneBounds(geometry);
  const { rows } = await sql<{ wafer_slot: number; zone: RadialZone; tested: number; pass: number }>`
    with placed as (
      select wafer_slot, bin,
             sqrt(((x - (min(x) over w + max(x) over w)::float8 / 2) * ${geometry.dieWidthMm}::float8) ^ 2
                + ((y - (min(y) over w + max(y) over w)::float8 / 2) * ${geometry.dieHeightMm}::float8) ^ 2) as r
        from dies where lot_id = ${lotId} window w as (partition by wafer_slot)
    )
    select wafer_slot,
           case when r <= ${bounds.centre}::float8 then 'centre' when r <= ${bounds.middle}::float8 then 'middle'
                when r <= ${bounds.edge}::float8 then 'edge' else 'outside' end as zone,
           count(*)::int as tested, count(*) filter (where bin = 'PASS')::int as pass
      from placed group by 1, 2 order by 1`.execute(tx);
  const byWafer = new Map<number, Record<RadialZone, { tested: number; pass: number }>>();
  for (const row of rows) {
    let counts = byWafer.get(row.wafer_slot);
    if (!counts) {
      counts = { centre: { tested: 0, pass: 0 }, middle: { tested: 0, pass: 0 }, edge: { tested: 0, pass: 0 }, outside: { tested: 0, pass: 0 } };
      byWafer.set(row.wafer_slot, counts);
    }
    counts[row.zone] = { tested: row.tested, pass: row.pass };
  }
  return [...byWafer].map(([wafer, counts]) => {
    const zones = zoneYieldsFromCounts(counts);
    const { edgeYield, centreYield, gap } = edgeVersusCentre(zones);
    const ring = gap !== null && gap >= EDGE_RING_MIN_GAP && zones.edge.tested >= EDGE_RING_MIN_EDGE_DIES;
    return { wafer, edgeYield, centreYield, gap, edgeTested: zones.edge.tested, ring };
  });
}
