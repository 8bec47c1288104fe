import "server-only";
import type { Kysely } from "kysely";
import { BINS } from "@/domain/transport";
import type { MapDie } from "@/domain/wafer-map";
import type { Bin } from "@/domain/yield";
import { PARAMETRIC_BINS } from "@/domain/yield/lot-analysis";
import type { Product } from "@/lib/schemas/products";
import { listDies } from "../db/queries/dies";
import { getLotDetail } from "../db/queries/lots";
import { getProduct } from "../db/queries/products";
import type { Database } from "../db/schema";

export interface LotReport {
  lot: string;
  product: Pick<Product, "code" | "name" | "specLowS" | "specHighS" | "displayUnit" | "dieWidthMm" | "dieHeightMm" | "waferDiameterMm" | "edgeExclusionMm">;
  customer: string | null;
  status: string;
  releasedAt: string | null;
  probedAt: string;
  chuckTemperatureK: number;
  tested: number;
  pass: number;
  shippedPass: number;
  yield: number | null;
  shippedYield: number | null;
  medianConductanceS: number | null;
  withinSpecFraction: number | null;
  wafers: { wafer: number; tested: number; pass: number; inked: number; yield: number | null; shippedYield: number | null; medianConductanceS: number | null }[];
  bins: { bin: string; count: number; fraction: number }[];
  maps: { wafer: number; dies: MapDie[] }[];
}

const ratio = (a: number, b: number) => (b ? a / b : null);

/**
 * The customer lot report: yields, bins, bin maps and the conductance summary against the spec window — nothing
 * internal (no control limits, excursions, comments or raw files). The page and the PDF use the same numbers.
 * Row-level security keeps a customer to its own released lots.
 */
export async function buildLotReport(tx: Kysely<Database>, lotNumber: string): Promise<LotReport> {
  const lot = await getLotDetail(tx, lotNumber);
  const product = await getProduct(tx, lot.product);
  const dies = await listDies(tx, lot.id, { format: "json" });
  const measured = dies.filter((d) => d.conductanceS !== null && PARAMETRIC_BINS.includes(d.bin as Bin));
  const inSpec = measured.filter((d) => (product.specLowS === null || d.conductanceS! >= product.specLowS) && (product.specHighS === null || d.conductanceS! <= product.specHighS));
  const shippedPass = dies.filter((d) => d.bin === "PASS" && !d.inked).length;
  const maps = lot.wafers.map((w) => ({
    wafer: w.wafer,
    dies: dies
      .filter((d) => d.wafer === w.wafer)
      .map((d) => ({ x: d.x, y: d.y, conductanceS: d.conductanceS, bin: d.bin as MapDie["bin"], outOfWindow: false, inked: d.inked, modes: d.modes, nonlinearity: d.nonlinearity, r2: d.r2, pointsInWindow: d.pointsInWindow, windowV: d.windowV, temperatureK: d.temperatureK })),
  }));
  const { code, name, specLowS, specHighS, displayUnit, dieWidthMm, dieHeightMm, waferDiameterMm, edgeExclusionMm } = product;
  return {
    lot: lot.lot,
    product: { code, name, specLowS, specHighS, displayUnit, dieWidthMm, dieHeightMm, waferDiameterMm, edgeExclusionMm },
    customer: lot.customer,
    status: lot.status,
    releasedAt: lot.releasedAt,
    probedAt: lot.probedAt,
    chuckTemperatureK: lot.chuckTemperatureK,
    tested: lot.tested,
    pass: lot.pass,
    shippedPass,
    yield: lot.yield,
    shippedYield: ratio(shippedPass, lot.tested),
    medianConductanceS: lot.medianConductanceS,
    withinSpecFraction: ratio(inSpec.length, measured.length),
    wafers: lot.wafers.map((w) => ({ wafer: w.wafer, tested: w.tested, pass: w.pass, inked: w.inked, yield: w.yield, shippedYield: ratio(w.pass - w.inked, w.tested), medianConductanceS: w.medianConductanceS })),
    bins: BINS.map((bin) => ({ bin, count: lot.bins[bin] ?? 0, fraction: ratio(lot.bins[bin] ?? 0, lot.tested) ?? 0 })).filter((b) => b.count > 0),
    maps,
  };
}
