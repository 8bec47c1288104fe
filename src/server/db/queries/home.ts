import "server-only";
import { type Kysely, sql } from "kysely";
import type { Database } from "../schema";

export interface AttentionLot {
  lot: string;
  product: string;
  status: string;
  yield: number | null;
  yieldFloor: number | null;
  probedAt: string;
}

export interface AttentionJob {
  id: string;
  fileName: string | null;
  message: string;
  line: number | null;
  at: string;
}

/** What an engineer should look at first: lots on hold, lots under their product's yield floor, failed uploads. */
export async function getAttention(tx: Kysely<Database>): Promise<{ holds: AttentionLot[]; underFloor: AttentionLot[]; failedJobs: AttentionJob[] }> {
  const lots = tx
    .selectFrom("lots as l")
    .innerJoin("products as p", (j) => j.onRef("p.tenant_id", "=", "l.tenant_id").onRef("p.id", "=", "l.product_id"))
    .select(["l.lot_number", "p.code", "l.status", "l.pass", "l.tested", "p.yield_floor", "l.probed_at"]);
  const toLot = (r: { lot_number: string; code: string; status: string; pass: number; tested: number; yield_floor: number | null; probed_at: Date }): AttentionLot => ({
    lot: r.lot_number, product: r.code, status: r.status, yield: r.tested ? r.pass / r.tested : null, yieldFloor: r.yield_floor, probedAt: r.probed_at.toISOString(),
  });
  const holds = await lots.where("l.status", "=", "on hold").orderBy("l.status_changed_at", "desc").limit(20).execute();
  const underFloor = await lots
    .where("l.status", "in", ["probed", "on hold"])
    .where("p.yield_floor", "is not", null)
    .where(sql<boolean>`l.tested > 0 and l.pass::float8 / l.tested < p.yield_floor`)
    .orderBy("l.probed_at", "desc")
    .limit(20)
    .execute();
  const failed = await tx
    .selectFrom("ingest_jobs as j")
    .innerJoin("raw_files as f", (join) => join.onRef("f.tenant_id", "=", "j.tenant_id").onRef("f.id", "=", "j.raw_file_id"))
    .select(["j.id", "f.file_name", "j.error_message", "j.error_line", "j.finished_at", "j.created_at"])
    .where("j.status", "=", "failed")
    .where("j.created_at", ">", sql<Date>`now() - interval '14 days'`)
    .orderBy("j.created_at", "desc")
    .limit(10)
    .execute();
  return {
    holds: holds.map(toLot),
    underFloor: underFloor.map(toLot),
    failedJobs: failed.map((j) => ({ id: j.id, fileName: j.file_name, message: j.error_message ?? "", line: j.error_line, at: (j.finished_at ?? j.created_at).toISOString() })),
  };
}

export interface ProductTrend {
  product: string;
  unit: "S" | "uS" | "G0";
  yields: number[];
  medians: number[];
  lastYield: number | null;
  lastMedianS: number | null;
}

/** The last 30 lots of each product, oldest first, for the home page's sparklines. */
export async function getProductTrends(tx: Kysely<Database>): Promise<ProductTrend[]> {
  const rows = await sql<{ code: string; display_unit: "S" | "uS" | "G0"; pass: number; tested: number; median_conductance_s: number | null }>`
    select code, display_unit, pass, tested, median_conductance_s from (
      select p.code, p.display_unit, l.pass, l.tested, l.median_conductance_s, l.probed_at,
             row_number() over (partition by p.id order by l.probed_at desc) as n
        from lots l join products p on p.tenant_id = l.tenant_id and p.id = l.product_id
       where l.tested > 0) t
    where n <= 30 order by code, probed_at`.execute(tx);
  const trends = new Map<string, ProductTrend>();
  for (const r of rows.rows) {
    const t = trends.get(r.code) ?? { product: r.code, unit: r.display_unit, yields: [], medians: [], lastYield: null, lastMedianS: null };
    t.yields.push(r.pass / r.tested);
    if (r.median_conductance_s !== null) t.medians.push(r.median_conductance_s);
    t.lastYield = r.pass / r.tested;
    t.lastMedianS = r.median_conductance_s;
    trends.set(r.code, t);
  }
  return [...trends.values()];
}
