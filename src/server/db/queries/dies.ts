import "server-only";
import type { Kysely } from "kysely";
import { type DieFilters, type DieRecord } from "@/lib/schemas/lots";
import { decodeSweep } from "../../jobs/sweep-codec";
import type { Database } from "../schema";

/** A lot's dies with every §5 field, filtered; the raw sweep only when asked for (the die drawer). */
export async function listDies(tx: Kysely<Database>, lotId: string, filters: DieFilters): Promise<DieRecord[]> {
  let q = tx
    .selectFrom("dies")
    .select([
      "wafer_slot", "x", "y", "conductance_s", "offset_a", "r2", "points_in_window", "window_v", "nonlinearity", "nonlinearity_window_only",
      "modes", "bin", "reason", "out_of_window", "inked", "temperature_k", "site", "points",
    ])
    .where("lot_id", "=", lotId);
  if (filters.include === "sweep") q = q.select("sweep");
  if (filters.wafer !== undefined) q = q.where("wafer_slot", "=", filters.wafer);
  if (filters.bin !== undefined) q = q.where("bin", "in", Array.isArray(filters.bin) ? filters.bin : [filters.bin]);
  if (filters.outOfWindow !== undefined) q = q.where("out_of_window", "=", filters.outOfWindow);
  if (filters.x !== undefined) q = q.where("x", "=", filters.x);
  if (filters.y !== undefined) q = q.where("y", "=", filters.y);
  const rows = await q.orderBy("wafer_slot").orderBy("y").orderBy("x").execute();
  return rows.map((d) => {
    const die: DieRecord = {
      wafer: d.wafer_slot,
      x: d.x,
      y: d.y,
      conductanceS: d.conductance_s,
      offsetA: d.offset_a,
      r2: d.r2,
      pointsInWindow: d.points_in_window,
      windowV: d.window_v,
      nonlinearity: d.nonlinearity,
      nonlinearityWindowOnly: d.nonlinearity_window_only,
      modes: d.modes,
      bin: d.bin,
      reason: d.reason,
      outOfWindow: d.out_of_window,
      inked: d.inked,
      temperatureK: d.temperature_k,
      site: d.site,
      points: d.points,
    };
    if ("sweep" in d && d.sweep) {
      const s = decodeSweep(d.sweep as Buffer);
      die.sweep = { biasV: Array.from(s.biasV), currentA: Array.from(s.currentA), compliance: Array.from(s.compliance, (c) => c === 1) };
    }
    return die;
  });
}
