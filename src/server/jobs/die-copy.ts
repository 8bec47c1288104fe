import "server-only";
import type { DieResult } from "@/domain/transport";

// Rows for COPY … FROM STDIN in PostgreSQL's text format: tab-separated, \N for NULL, backslash escapes.
export const TMP_DIE_COLUMNS = [
  "wafer_slot", "x", "y", "conductance_s", "offset_a", "r2", "points_in_window", "window_v", "nonlinearity",
  "nonlinearity_window_only", "modes", "bin", "reason", "temperature_k", "site", "points", "sweep", "first_line",
] as const;

export const CREATE_TMP_DIES = `create temp table tmp_dies (
  wafer_slot integer, x integer, y integer, conductance_s float8, offset_a float8, r2 float8, points_in_window integer,
  window_v float8, nonlinearity float8, nonlinearity_window_only boolean, modes float8, bin text, reason text,
  temperature_k float8, site text, points integer, sweep bytea, first_line integer) on commit drop`;

function num(value: number | null): string {
  return value === null || !Number.isFinite(value) ? "\\N" : String(value);
}

function text(value: string | null): string {
  if (value === null) return "\\N";
  return value.replace(/\\/g, "\\\\").replace(/\t/g, "\\t").replace(/\n/g, "\\n").replace(/\r/g, "\\r");
}

export function dieCopyLine(wafer: number, x: number, y: number, r: DieResult, site: string | null, points: number, sweep: Buffer, firstLine: number): string {
  return [
    wafer, x, y, num(r.conductanceS), num(r.offsetA), num(r.r2), r.pointsInWindow, num(r.windowV), num(r.nonlinearity),
    r.nonlinearityWindowOnly ? "t" : "f", num(r.modes), r.bin, text(r.reason), num(r.temperatureK), text(site), points,
    `\\\\x${sweep.toString("hex")}`, firstLine,
  ].join("\t") + "\n";
}
