import "server-only";
import type { Kysely, Selectable } from "kysely";
import type { BaselineLimitValues } from "@/domain/spc";
import type { LimitBaseline, LimitSetView } from "@/lib/schemas/limits";
import { computeLimits, type LimitProduct } from "../../spc/limit-computation";
import type { Scope } from "../scope";
import type { Database, LimitSetsTable } from "../schema";
import { recordAudit } from "./audit";

export type LimitSetRow = Selectable<LimitSetsTable>;

interface StoredBaseline {
  kind: "lots" | "dates";
  lots: string[];
  from: string | null;
  to: string | null;
}

export function toLimitSetView(r: LimitSetRow): LimitSetView {
  const baseline = r.baseline as StoredBaseline;
  return {
    version: r.version,
    frozenAt: r.frozen_at.toISOString(),
    frozenBy: r.frozen_by_label,
    baseline: { kind: baseline.kind, from: baseline.from, to: baseline.to },
    lots: baseline.lots,
    lotCount: r.lot_count,
    waferCount: r.wafer_count,
    dieCount: r.die_count,
    limits: r.limits as BaselineLimitValues,
    dieWindow:
      r.die_window_low_s === null || r.die_window_high_s === null
        ? null
        : { lowS: r.die_window_low_s, highS: r.die_window_high_s, centerS: r.die_window_center_s ?? Number.NaN, sigmaS: r.die_window_sigma_s ?? Number.NaN, k: r.die_window_k },
    rules: r.rules,
    note: r.note,
  };
}

/** Every frozen version of a product, newest first. */
export async function listLimitSets(tx: Kysely<Database>, productId: string): Promise<LimitSetView[]> {
  const rows = await tx.selectFrom("limit_sets").selectAll().where("product_id", "=", productId).orderBy("version", "desc").execute();
  return rows.map(toLimitSetView);
}

/** The version in force at an instant: the latest one frozen at or before it; null before the first freeze. */
export async function limitSetInForce(tx: Kysely<Database>, productId: string, at: Date): Promise<LimitSetRow | null> {
  const row = await tx
    .selectFrom("limit_sets")
    .selectAll()
    .where("product_id", "=", productId)
    .where("frozen_at", "<=", at)
    .orderBy("frozen_at", "desc")
    .orderBy("version", "desc")
    .limit(1)
    .executeTakeFirst();
  return row ?? null;
}

/** When the version after this one was frozen (the end of its period), or null while it is the latest. */
export async function supersededAt(tx: Kysely<Database>, limitSet: LimitSetRow): Promise<Date | null> {
  const next = await tx
    .selectFrom("limit_sets")
    .select("frozen_at")
    .where("product_id", "=", limitSet.product_id)
    .where("version", ">", limitSet.version)
    .orderBy("version")
    .limit(1)
    .executeTakeFirst();
  return next?.frozen_at ?? null;
}

/** Computes limits from the baseline and freezes them as the product's next version, audited. */
export async function freezeLimitSet(tx: Kysely<Database>, scope: Scope, product: LimitProduct, baseline: LimitBaseline): Promise<LimitSetView> {
  // Serialises two freezes of one product so each gets its own version number.
  await tx.selectFrom("products").select("id").where("id", "=", product.id).forUpdate().executeTakeFirstOrThrow();
  const computed = await computeLimits(tx, product, baseline);
  const last = await tx.selectFrom("limit_sets").select((eb) => eb.fn.max("version").as("v")).where("product_id", "=", product.id).executeTakeFirst();
  const version = Number(last?.v ?? 0) + 1;
  const stored: StoredBaseline = "lots" in baseline
    ? { kind: "lots", lots: computed.lots, from: null, to: null }
    : { kind: "dates", lots: computed.lots, from: new Date(baseline.from).toISOString(), to: new Date(baseline.to).toISOString() };
  const row = await tx
    .insertInto("limit_sets")
    .values({
      tenant_id: scope.tenantId,
      product_id: product.id,
      version,
      baseline: JSON.stringify(stored),
      limits: JSON.stringify(computed.limits),
      lot_count: computed.lotCount,
      wafer_count: computed.waferCount,
      die_count: computed.dieCount,
      die_window_low_s: computed.dieWindow?.lowS ?? null,
      die_window_high_s: computed.dieWindow?.highS ?? null,
      die_window_center_s: computed.dieWindow?.centerS ?? null,
      die_window_sigma_s: computed.dieWindow?.sigmaS ?? null,
      die_window_k: computed.dieWindow?.k ?? product.dieWindowK,
      rules: product.rules,
      note: baseline.note ?? null,
      frozen_by: scope.userId,
      frozen_by_label: scope.actorLabel,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
  await recordAudit(tx, scope, "limits.frozen", { type: "product", id: product.code }, { version, baseline: stored, waferCount: computed.waferCount });
  return toLimitSetView(row);
}
