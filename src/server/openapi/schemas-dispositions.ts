import "server-only";
import { LOT_STATUSES } from "@/lib/schemas/lots";
import { binCounts, isoDateTime } from "./components";
import { z } from "./zod-openapi";

// Dispositions and the customer lot report (§6, §9). Their handlers are being added alongside this document,
// so these shapes are described here rather than imported from src/lib/schemas/.

export const dispositionBody = z
  .object({
    action: z.enum(["hold", "release", "scrap"]).describe("hold → on hold, release → released (e-mails the customer's users), scrap → scrapped"),
    reason: z.string().trim().min(1).max(2000).describe("Why; required and kept in the audit trail"),
    overrideReason: z.string().trim().min(1).max(2000).optional().describe("Required to release a lot that still has an open excursion: why it may ship anyway"),
  })
  .openapi("Disposition");

export const inkBody = z
  .object({
    wafer: z.number().int().min(1).max(25).describe("Wafer slot"),
    dies: z.array(z.tuple([z.number().int(), z.number().int()])).min(1).max(100_000).describe("Die grid indices [x, y]"),
    inked: z.boolean().describe("true inks the dies (they count as fails in the shipped yield); false removes the ink"),
  })
  .openapi("Ink");

export const dispositionResultSchema = z
  .object({
    lot: z.string(),
    status: z.enum(LOT_STATUSES).describe("The lot's status after the change"),
    previousStatus: z.enum(LOT_STATUSES),
    action: z.enum(["hold", "release", "scrap"]),
    reason: z.string(),
    by: z.string().describe("Who set it"),
    at: isoDateTime,
    overrideReason: z.string().nullable().optional(),
    releasedAt: isoDateTime.nullable().optional(),
    notified: z.number().int().optional().describe("How many customer users the release e-mail was queued for"),
  })
  .openapi("DispositionResult");

const shipped = z.number().min(0).max(1).nullable().describe("Shipped yield, a fraction 0–1: PASS dies that were not inked / tested");

export const lotReportSchema = z
  .object({
    lot: z.string(),
    product: z.string().describe("Product code"),
    productName: z.string(),
    customer: z.string().nullable(),
    status: z.enum(LOT_STATUSES),
    chuckTemperatureK: z.number().describe("Chuck temperature, in K"),
    probedAt: isoDateTime,
    releasedAt: isoDateTime.nullable(),
    specLowS: z.number().nullable().describe("Lower spec limit on G, in S"),
    specHighS: z.number().nullable().describe("Upper spec limit on G, in S"),
    tested: z.number().int(),
    pass: z.number().int(),
    yield: z.number().min(0).max(1).nullable().describe("Lot yield, a fraction 0–1 (PASS / tested)"),
    shippedYield: shipped,
    bins: binCounts,
    wafers: z.array(
      z.object({
        wafer: z.number().int().min(1).max(25),
        tested: z.number().int(),
        pass: z.number().int(),
        yield: z.number().min(0).max(1).nullable(),
        shippedYield: shipped,
        medianConductanceS: z.number().nullable().describe("Median G over the parametric dies (all but NODATA, OPEN and SHORT), in S"),
        bins: binCounts,
      }),
    ),
  })
  .openapi("LotReport", { description: "The customer lot report: yields, bins and the spec window; no control limits or excursion internals." });

export const reportQuery = z.object({ format: z.enum(["json", "pdf"]).default("json").describe("`json` (default) or `pdf` for the printable report") });
