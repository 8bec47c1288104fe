import "server-only";
import type { Kysely } from "kysely";
import { assignZones, type Bin, edgeVersusCentre, waferGeometry, type WaferGeometryInput, zoneYields } from "@/domain/yield";
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

/** Per wafer of the lot: centre and edge zone yields (equal-area radial zones from domain/yield) and the ring verdict. */
export async function edgeChecks(tx: Kysely<Database>, lotId: string, geometryInput: WaferGeometryInput): Promise<EdgeCheck[]> {
  const geometry = waferGeometry(geometryInput);
  const dies = await tx.selectFrom("dies").select(["wafer_slot", "x", "y", "bin"]).where("lot_id", "=", lotId).execute();
  const byWafer = new Map<number, { x: number; y: number; bin: Bin }[]>();
  for (const d of dies) {
    const list = byWafer.get(d.wafer_slot) ?? [];
    list.push({ x: d.x, y: d.y, bin: d.bin as Bin });
    byWafer.set(d.wafer_slot, list);
  }
  return [...byWafer.entries()]
    .sort(([a], [b]) => a - b)
    .map(([wafer, list]) => {
      const zones = zoneYields(assignZones(list, geometry));
      const { edgeYield, centreYield, gap } = edgeVersusCentre(zones);
      const ring = gap !== null && gap >= EDGE_RING_MIN_GAP && zones.edge.tested >= EDGE_RING_MIN_EDGE_DIES;
      return { wafer, edgeYield, centreYield, gap, edgeTested: zones.edge.tested, ring };
    });
}
