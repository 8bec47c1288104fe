import "server-only";
import { type Kysely, sql } from "kysely";
import { type BaselineWafer, limitSetFromBaseline, MAD_NORMAL_CONSISTENCY, normalityHint } from "@/domain/spc";
import type { DieWindowView, LimitBaseline, LimitComputation } from "@/lib/schemas/limits";
import type { Database } from "../db/schema";
import { AppError } from "../http/errors";
import { PARAMETRIC_BINS } from "./series";

const HISTOGRAM_BINS = 40;

export interface LimitProduct {
  id: string;
  code: string;
  rules: "western-electric" | "nelson";
  dieWindow: "static" | "pat";
  dieWindowK: number;
}

interface BaselineLot {
  id: string;
  lot_number: string;
  probed_at: Date;
}

async function baselineLots(tx: Kysely<Database>, product: LimitProduct, baseline: LimitBaseline): Promise<BaselineLot[]> {
  let q = tx.selectFrom("lots").select(["id", "lot_number", "probed_at"]).where("product_id", "=", product.id);
  if ("lots" in baseline) q = q.where("lot_number", "in", baseline.lots);
  else q = q.where("probed_at", ">=", new Date(baseline.from)).where("probed_at", "<=", new Date(baseline.to));
  const lots = await q.orderBy("probed_at").orderBy("lot_number").execute();
  if ("lots" in baseline) {
    const found = new Set(lots.map((l) => l.lot_number));
    const missing = [...new Set(baseline.lots)].filter((l) => !found.has(l));
    if (missing.length) {
      throw new AppError("unprocessable", `Not lots of ${product.code}: ${missing.join(", ")}`, missing.map((lot) => ({ path: "lots", message: `${lot}: no such lot of ${product.code}` })));
    }
  }
  if (lots.length === 0) throw new AppError("unprocessable", `No lots of ${product.code} were probed in that range`, [{ path: "from", message: "no lots in range" }]);
  return lots;
}

/**
 * Static die window over the baseline's parametric dies, median ± k·1.4826·MAD (§6), computed in SQL so a large
 * baseline is never loaded into memory; the consistency constant comes from the domain module.
 */
async function dieStatistics(tx: Kysely<Database>, lotIds: string[], k: number) {
  const { rows } = await sql<{ n: string; med: number | null; mad: number | null; lo: number | null; hi: number | null }>`
    with d as (select conductance_s as g from dies where lot_id = any(${lotIds}::uuid[]) and bin in (${sql.join(PARAMETRIC_BINS)}) and conductance_s is not null),
         m as (select percentile_cont(0.5) within group (order by g) as med from d)
    select (select count(*) from d) as n, m.med, (select percentile_cont(0.5) within group (order by abs(d.g - m.med)) from d) as mad,
           (select min(g) from d) as lo, (select max(g) from d) as hi
      from m`.execute(tx);
  const stats = rows[0]!;
  const dieCount = Number(stats.n);
  const dieWindow: DieWindowView | null =
    stats.med === null || stats.mad === null
      ? null
      : { centerS: stats.med, sigmaS: MAD_NORMAL_CONSISTENCY * stats.mad, k, lowS: stats.med - k * MAD_NORMAL_CONSISTENCY * stats.mad, highS: stats.med + k * MAD_NORMAL_CONSISTENCY * stats.mad };
  let histogram = { edgesS: [] as number[], counts: [] as number[] };
  if (stats.lo !== null && stats.hi !== null && dieCount > 0) {
    // Round the range outward to two significant digits of its span, so the axis ends on readable numbers.
    const span = stats.hi > stats.lo ? stats.hi - stats.lo : Math.abs(stats.lo || 1) * 1e-6;
    const step = 10 ** (Math.floor(Math.log10(span)) - 1);
    const lo = Math.floor(stats.lo / step) * step;
    const hi = Math.max(Math.ceil(stats.hi / step) * step, lo + step);
    const width = (hi - lo) / HISTOGRAM_BINS;
    const counted = await sql<{ b: number; n: string }>`
      select least(width_bucket(conductance_s, ${lo}::float8, ${hi}::float8, ${HISTOGRAM_BINS}), ${HISTOGRAM_BINS}) as b, count(*) as n
        from dies where lot_id = any(${lotIds}::uuid[]) and bin in (${sql.join(PARAMETRIC_BINS)}) and conductance_s is not null group by 1`.execute(tx);
    const counts = Array<number>(HISTOGRAM_BINS).fill(0);
    for (const r of counted.rows) counts[Math.max(1, r.b) - 1]! += Number(r.n);
    histogram = { edgesS: Array.from({ length: HISTOGRAM_BINS + 1 }, (_, i) => lo + i * width), counts };
  }
  return { dieCount, dieWindow, histogram };
}

/** Limits from a baseline (lots in probing order, wafers by slot), its die window, histogram and normality hint. */
export async function computeLimits(tx: Kysely<Database>, product: LimitProduct, baseline: LimitBaseline): Promise<LimitComputation & { lotIds: string[] }> {
  const lots = await baselineLots(tx, product, baseline);
  const lotIds = lots.map((l) => l.id);
  const wafers = await tx
    .selectFrom("wafers")
    .select(["lot_id", "slot", "median_conductance_s", "tested", "pass"])
    .where("lot_id", "in", lotIds)
    .orderBy("slot")
    .execute();
  const byLot = new Map<string, BaselineWafer[]>(lotIds.map((id) => [id, []]));
  for (const w of wafers) {
    byLot.get(w.lot_id)!.push({ medianConductanceS: w.median_conductance_s ?? Number.NaN, yieldFraction: w.tested > 0 ? w.pass / w.tested : Number.NaN });
  }
  const grouped = lotIds.map((id) => byLot.get(id)!);
  let limits;
  try {
    limits = limitSetFromBaseline(grouped);
  } catch (error) {
    if (error instanceof RangeError) throw new AppError("unprocessable", `The baseline cannot give limits: ${error.message}`, [{ path: "lots", message: error.message }]);
    throw error;
  }
  const medians = grouped.flat().map((w) => w.medianConductanceS).filter(Number.isFinite);
  const { dieCount, dieWindow, histogram } = await dieStatistics(tx, lotIds, product.dieWindow === "static" ? product.dieWindowK : 3);
  return {
    lotIds,
    lots: lots.map((l) => l.lot_number),
    lotCount: lots.length,
    waferCount: wafers.length,
    dieCount,
    limits,
    dieWindow,
    rules: product.rules,
    histogram,
    normality: normalityHint(medians),
  };
}
