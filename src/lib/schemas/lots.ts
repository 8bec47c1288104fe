import { z } from "zod";

export const LOT_STATUSES = ["receiving", "probed", "on hold", "released", "scrapped"] as const;
export type LotStatus = (typeof LOT_STATUSES)[number];
export const BIN_NAMES = ["NODATA", "SHORT", "OPEN", "NONLINEAR", "LOW", "HIGH", "PASS"] as const;

const isoDate = z.string().refine((v) => !Number.isNaN(Date.parse(v)), "Use an ISO 8601 date or time");

export const lotFiltersSchema = z.object({
  product: z.string().trim().max(40).optional(),
  status: z.enum(LOT_STATUSES).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  customer: z.string().uuid().optional(),
  q: z.string().trim().max(64).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
  sort: z.enum(["probedAt", "lot", "yield"]).default("probedAt"),
  order: z.enum(["asc", "desc"]).default("desc"),
});
export type LotFilters = z.infer<typeof lotFiltersSchema>;

const flag = z.enum(["true", "false", "1", "0"]).transform((v) => v === "true" || v === "1");

/** The §9 die fields a client may pick with `fields` (the sweep comes with include=sweep). */
export const DIE_FIELD_NAMES = [
  "wafer", "x", "y", "conductanceS", "offsetA", "r2", "pointsInWindow", "windowV", "nonlinearity", "modes", "bin",
  "outOfWindow", "temperatureK", "inked", "nonlinearityWindowOnly", "reason", "site", "points",
] as const;
export type DieField = (typeof DIE_FIELD_NAMES)[number];

export const dieFiltersSchema = z.object({
  wafer: z.coerce.number().int().min(1).max(25).optional(),
  bin: z.union([z.enum(BIN_NAMES), z.string().transform((v) => v.split(",")).pipe(z.array(z.enum(BIN_NAMES)))]).optional(),
  outOfWindow: flag.optional(),
  x: z.coerce.number().int().optional(),
  y: z.coerce.number().int().optional(),
  include: z.enum(["sweep"]).optional(),
  /** Only these §9 fields per die (wafer, x and y always come): a lot-wide map needs 4 of the 18. */
  fields: z
    .string()
    .transform((v) => v.split(","))
    .pipe(z.array(z.enum(DIE_FIELD_NAMES)).min(1))
    .optional(),
  format: z.enum(["json", "csv"]).default("json"),
});
export type DieFilters = z.infer<typeof dieFiltersSchema>;

export interface LotListItem {
  lot: string;
  product: string;
  customerId: string | null;
  customer: string | null;
  status: LotStatus;
  chuckTemperatureK: number;
  station: string | null;
  probedAt: string;
  wafers: number;
  tested: number;
  pass: number;
  yield: number | null;
  medianConductanceS: number | null;
  outOfWindow: number;
}

export interface WaferSummary {
  wafer: number;
  tested: number;
  pass: number;
  yield: number | null;
  medianConductanceS: number | null;
  outOfWindow: number;
  inked: number;
  bins: Record<string, number>;
  windowLowS: number | null;
  windowHighS: number | null;
  probedAt: string;
}

export interface LotDetail extends Omit<LotListItem, "wafers"> {
  attributes: Record<string, string>;
  wafers: WaferSummary[];
  bins: Record<string, number>;
  statusChangedAt: string;
  releasedAt: string | null;
  openExcursions: { id: string; title: string; openedAt: string }[];
}

export interface DieRecord {
  wafer: number;
  x: number;
  y: number;
  conductanceS: number | null;
  offsetA: number | null;
  r2: number | null;
  pointsInWindow: number;
  windowV: number;
  nonlinearity: number | null;
  nonlinearityWindowOnly: boolean;
  modes: number | null;
  bin: string;
  reason: string | null;
  outOfWindow: boolean;
  inked: boolean;
  temperatureK: number;
  site: string | null;
  points: number;
  sweep?: { biasV: number[]; currentA: number[]; compliance: boolean[] };
}

/** The §9 die fields, in the order CSV exports carry them. */
export const DIE_CSV_COLUMNS = DIE_FIELD_NAMES;
