import "server-only";
import { type Kysely } from "kysely";
import { capability, xbarSChart } from "@/domain/spc";
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
 * the X̄–S chart with each wafer a subgroup (s̄/c₄), σ overall the sample sd of every die.
 */
export async function dieCapability(tx: Kysely<Database>, lotIds: string[], spec: { specLowS: number | null; specHighS: number | null }): Promise<CapabilityResult> {
  if (spec.specLowS === null && spec.specHighS === null) return { capability: null, reason: "the product has no spec window" };
  if (lotIds.length === 0) return { capability: null, reason: "no lots" };
  const rows = await tx
    .selectFrom("dies")
    .select(["lot_id", "wafer_slot", "conductance_s"])
    .where("lot_id", "in", lotIds)
    .where("bin", "in", [...PARAMETRIC_BINS])
    .where("conductance_s", "is not", null)
    .execute();
  const byWafer = new Map<string, number[]>();
  for (const r of rows) {
    const key = `${r.lot_id}:${r.wafer_slot}`;
    const list = byWafer.get(key) ?? [];
    list.push(r.conductance_s!);
    byWafer.set(key, list);
  }
  const subgroups = [...byWafer.values()].filter((g) => g.length >= 2);
  const values = subgroups.flat();
  if (subgroups.length === 0 || values.length < 2) return { capability: null, reason: "fewer than 2 measured dies on any wafer" };
  const chart = xbarSChart(subgroups);
  const c = capability({ values, specLow: spec.specLowS, specHigh: spec.specHighS, withinSigma: chart.withinSigma });
  const within = chart.pooled ? `pooled s/c₄ within wafers over ${subgroups.length} wafers` : `s̄/c₄ within wafers over ${subgroups.length} wafers`;
  return {
    reason: null,
    capability: {
      cp: c.cp, cpk: c.cpk, pp: c.pp, ppk: c.ppk, meanS: c.mean, withinSigmaS: c.withinSigma, overallSigmaS: c.overallSigma,
      dies: values.length, wafers: subgroups.length,
      sigmaNote: `Cp, Cpk use σ within = ${within}; Pp, Ppk use the overall sample σ of ${values.length} dies.`,
    },
  };
}
