import "server-only";
import { BIN_NAMES, DIE_CSV_COLUMNS, type DieRecord, dieFiltersSchema, LOT_STATUSES, type LotDetail, lotFiltersSchema, type LotListItem, type WaferSummary } from "@/lib/schemas/lots";
import { binCounts, isoDateTime } from "./components";
import { describeFields, mirrors, z } from "./zod-openapi";

const fraction = (what: string) => z.number().min(0).max(1).nullable().describe(`${what}, a fraction 0–1 (PASS / tested); null when nothing was tested`);
const medianG = z.number().nullable().describe("Median die conductance G over the parametric dies (all but NODATA, OPEN and SHORT), in S");

const lotFields = {
  lot: z.string().describe("Lot number, unique in the tenant"),
  product: z.string().describe("Product code"),
  customerId: z.string().uuid().nullable().describe("The owning customer account, null for the fab's own products"),
  customer: z.string().nullable().describe("The owning customer's name"),
  status: z.enum(LOT_STATUSES).describe("receiving → probed → on hold / released / scrapped"),
  chuckTemperatureK: z.number().describe("Chuck temperature of the probe file, in K"),
  station: z.string().nullable().describe("Probe station from the file's `# station:` metadata"),
  probedAt: isoDateTime,
  tested: z.number().int().describe("Dies tested"),
  pass: z.number().int().describe("Dies binned PASS"),
  yield: fraction("Lot yield"),
  medianConductanceS: medianG,
  outOfWindow: z.number().int().describe("Dies outside the die window (§6), flagged on the wafer maps"),
};

const lotListItemSchema = mirrors<LotListItem>()(
  z.object({ ...lotFields, wafers: z.number().int().describe("Number of wafers probed") }).openapi("LotListItem"),
);

export const lotListSchema = z
  .object({
    lots: z.array(lotListItemSchema),
    page: z.number().int().describe("1-based page number"),
    pageSize: z.number().int(),
    total: z.number().int().describe("Lots matching the filters, over all pages"),
  })
  .openapi("LotList");

const waferSummarySchema = mirrors<WaferSummary>()(
  z
    .object({
      wafer: z.number().int().min(1).max(25).describe("Slot number in the lot"),
      tested: z.number().int(),
      pass: z.number().int(),
      yield: fraction("Wafer yield"),
      medianConductanceS: medianG,
      outOfWindow: z.number().int().describe("Dies outside the die window"),
      inked: z.number().int().describe("Out-of-window dies inked: counted as fails in the shipped yield"),
      bins: binCounts,
      windowLowS: z.number().nullable().describe("Lower edge of this wafer's die window, in S"),
      windowHighS: z.number().nullable().describe("Upper edge of this wafer's die window, in S"),
      probedAt: isoDateTime,
    })
    .openapi("WaferSummary"),
);

export const lotDetailSchema = mirrors<LotDetail>()(
  z
    .object({
      ...lotFields,
      attributes: z.record(z.string(), z.string()).describe("The probe file's other `# key: value` metadata"),
      wafers: z.array(waferSummarySchema),
      bins: binCounts,
      statusChangedAt: isoDateTime,
      releasedAt: isoDateTime.nullable(),
      openExcursions: z.array(z.object({ id: z.string().uuid(), title: z.string(), openedAt: isoDateTime })).describe("Excursions still open on this lot"),
    })
    .openapi("LotDetail"),
);

const dieSchema = mirrors<DieRecord>()(
  z
    .object({
      wafer: z.number().int().min(1).max(25).describe("Wafer slot"),
      x: z.number().int().describe("Die column index on the wafer grid"),
      y: z.number().int().describe("Die row index on the wafer grid"),
      conductanceS: z.number().nullable().describe("Linear-response conductance G: OLS slope of I = G·V + I₀ over the in-window points, in S; null for NODATA"),
      offsetA: z.number().nullable().describe("Current offset I₀ of that fit, in A"),
      r2: z.number().nullable().describe("Coefficient of determination R² of the in-window fit (dimensionless)"),
      pointsInWindow: z.number().int().describe("Sweep points with |V| ≤ windowV"),
      windowV: z.number().describe("Thermal window V_w = w·kT/q, in V (0.5·kT/q ≈ 12.93 mV at 300 K)"),
      nonlinearity: z.number().nullable().describe("Nonlinearity index η = (|a₂|·V_w + |a₃|·V_w²)/|G₁| from a cubic fit of the whole sweep (dimensionless)"),
      nonlinearityWindowOnly: z.boolean().describe("True when the sweep never left the window, so η comes from the window points alone"),
      modes: z.number().nullable().describe("G in units of the conductance quantum G₀ = 2q²/h ≈ 7.748091729e-5 S"),
      bin: z.string().describe("First matching bin: NODATA, SHORT, OPEN, NONLINEAR, LOW, HIGH, PASS").openapi({ enum: [...BIN_NAMES] }),
      reason: z.string().nullable().describe("Why the die got a non-PASS bin, in plain words"),
      outOfWindow: z.boolean().describe("Outside the die window (§6): static median ± k·σ̂ or per-wafer Part Average Testing"),
      inked: z.boolean().describe("Inked: counted as a fail in the shipped yield"),
      temperatureK: z.number().describe("Temperature used for the window, in K (the row's temperature_k, else the chuck temperature)"),
      site: z.string().nullable().describe("The file's `site` column, when present"),
      points: z.number().int().describe("Sweep points recorded for the die"),
      sweep: z
        .object({
          biasV: z.array(z.number()).describe("Bias of each point, in V"),
          currentA: z.array(z.number()).describe("Current of each point, in A"),
          compliance: z.array(z.boolean()).describe("True where the source hit its compliance limit"),
        })
        .optional()
        .describe("The raw sweep, only with include=sweep"),
    })
    .openapi("Die", { description: "One die's §5 results. CSV exports carry the same names as columns." }),
);

export const dieListSchema = z
  .object({ lot: z.string(), count: z.number().int().describe("Dies returned"), dies: z.array(dieSchema) })
  .openapi("DieList");

export const dieCsvSchema = z.string().describe(`CSV with a header row: ${DIE_CSV_COLUMNS.join(",")}. Empty cells for null.`);

// bin takes the wire form here; the shared schema also accepts it, then splits the list.
export const lotFiltersQuery = describeFields(lotFiltersSchema, {
  product: "Product code",
  status: "Lot status",
  from: "Probed at or after this ISO 8601 date or time",
  to: "Probed at or before this ISO 8601 date or time",
  customer: "Customer account id",
  q: "Part of a lot number",
  page: "1-based page",
  pageSize: "Lots per page",
  sort: "Sort key",
  order: "Sort direction",
});

export const dieFiltersQuery = describeFields(dieFiltersSchema, {
  wafer: "Wafer slot",
  bin: "One bin, or several separated by commas (LOW,HIGH)",
  outOfWindow: "Only dies inside (false) or outside (true) the die window",
  x: "Die column index",
  y: "Die row index",
  include: "`sweep` adds each die's raw I–V points (bias in V, current in A)",
  fields: "Only these die fields, separated by commas (bin,conductanceS); wafer, x and y always come. For lot-wide maps: a tenth of the bytes",
  format: "`json` (default) or `csv`",
});
