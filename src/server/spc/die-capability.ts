import "server-only";
import { type Kysely, sql } from "kysely";
import { capabilityFromSummary, combineGroupSummaries, type SubgroupStats, xbarSChartFromStats } from "@/domain/spc";
import type { Database } from "../db/schema";
import { PARAMETRIC_BINS } from "./series";

export interface CapabilityView {
  cp: number | null;
  cpk: number;
  pp: number | null;
  ppk: number;
  meanS: number;
  withinSigmaS: number;
  overallSigmaS: number;
  dies: number;
  wafers: number;
  /** Which σ each index used, in words, for the page (issue 6: "with the σ used stated"). */
  sigmaNote: string;
}

export type CapabilityResult = { capability: CapabilityView; reason: null } | { capability: null; reason: string };

/**
 * Die-level Cp, Cpk, Pp, Ppk against the spec window (§6) over the parametric dies of the given lots: σ within from
 * the X̄–S chart with each wafer a subgroup (s̄/c₄), σ overall the sample sd of every die. PostgreSQL reduces each
 * wafer to its count, mean and sd, so memory stays flat however many dies the lots hold (see edgeChecks for what
 * loading the dies cost); the overall figures are combined from those.
 */
export async function dieCapability(tx: Kysely<Database>, lotIds: string[], spec: { specLowS: number | null; specHighS: number | null }): Promise<CapabilityResult> {
  if (spec.specLowS === null && spec.specHighS === null) return { capability: null, reason: "the product has no spec window" };
  if (lotIds.length === 0) return { capability: null, reason: "no lots" };
  const rows = await tx
    .selectFrom("dies")
    .select([
      sql<number>`count(*)::int`.as("size"),
      sql<number>`avg(conductance_s)`.as("mean"),
      sql<number>`stddev_samp(conductance_s)`.as("s"),
    ])
    .where("lot_id", "in", lotIds)
    .where("bin", "in", [...PARAMETRIC_BINS])
    .where("conductance_s", "is not", null)
    .groupBy(["lot_id", "wafer_slot"])
    .having(sql`count(*)`, ">=", 2)
    .orderBy("lot_id")
    .orderBy("wafer_slot")
    .execute();
  const subgroups: SubgroupStats[] = rows.map((r) => ({ size: r.size, mean: r.mean, s: r.s }));
  if (subgroups.length === 0) return { capability: null, reason: "fewer than 2 measured dies on any wafer" };
  const all = combineGroupSummaries(subgroups);
  const chart = xbarSChartFromStats(subgroups);
  const c = capabilityFromSummary({ count: all.size, mean: all.mean, overallSigma: all.s, specLow: spec.specLowS, specHigh: spec.specHighS, withinSigma: chart.withinSigma });
  const within = chart.pooled ? `pooled s/c₄ within wafers over ${subgroups.length} wafers` : `s̄/c₄ within wafers over ${subgroups.length} wafers`;
  return {
    reason: null,
    capability: {
      cp: c.cp, cpk: c.cpk, pp: c.pp, ppk: c.ppk, meanS: c.mean, withinSigmaS: c.withinSigma, overallSigmaS: c.overallSigma,
      dies: all.size, wafers: subgroups.length,
      sigmaNote: `Cp, Cpk use σ within = ${within}; Pp, Ppk use the overall sample σ of ${all.size.toLocaleString("en")} dies.`,
    },
  };
}
