import "server-only";
import type { Kysely, Selectable } from "kysely";
import type { BaselineLimitValues } from "@/domain/spc";
import type { LimitBaseline, LimitSetView } from "@/lib/schemas/limits";
import { computeLimits, type LimitProduct } from "../../spc/limit-computation";
import type { Scope } from "../scope";
import type { Database, LimitSetsTable } from "../schema";
import { AppError } from "../../http/errors";
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
    inForceFrom: r.in_force_from.toISOString(),
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

/** The version in force at an instant: the latest one in force from it or earlier; null before the first. */
export async function limitSetInForce(tx: Kysely<Database>, productId: string, at: Date): Promise<LimitSetRow | null> {
  const row = await tx
    .selectFrom("limit_sets")
    .selectAll()
    .where("product_id", "=", productId)
    .where("in_force_from", "<=", at)
    .orderBy("in_force_from", "desc")
    .orderBy("version", "desc")
    .limit(1)
    .executeTakeFirst();
  return row ?? null;
}

/** When the version after this one came into force (the end of this one's period), or null while it is the latest. */
export async function supersededAt(tx: Kysely<Database>, limitSet: LimitSetRow): Promise<Date | null> {
  const next = await tx
    .selectFrom("limit_sets")
    .select("in_force_from")
    .where("product_id", "=", limitSet.product_id)
    .where("version", ">", limitSet.version)
    .orderBy("version")
    .limit(1)
    .executeTakeFirst();
  return next?.in_force_from ?? null;
}

/**
 * A version normally comes into force when it is frozen. It may be put in force earlier, to judge lots already
 * probed since the baseline — but never before the newest baseline lot was probed, and never in the future.
 */
async function resolveInForceFrom(tx: Kysely<Database>, lotIds: string[], requested: string | undefined): Promise<Date> {
  const now = new Date();
  if (!requested) return now;
  const at = new Date(requested);
  const newest = await tx.selectFrom("lots").select((eb) => eb.fn.max("probed_at").as("t")).where("id", "in", lotIds).executeTakeFirst();
  const newestProbe = newest?.t ? new Date(newest.t as unknown as string) : null;
  if (at > now) throw new AppError("unprocessable", "inForceFrom: a limit set cannot come into force in the future", [{ path: "inForceFrom", message: "in the future" }]);
  if (newestProbe && at < newestProbe) {
    throw new AppError("unprocessable", `inForceFrom: the baseline's newest lot was probed ${newestProbe.toISOString()}; the limits cannot be in force before it`, [{ path: "inForceFrom", message: "before the baseline" }]);
  }
  return at;
}

/** Computes limits from the baseline and freezes them as the product's next version, audited. */
export async function freezeLimitSet(tx: Kysely<Database>, scope: Scope, product: LimitProduct, baseline: LimitBaseline): Promise<LimitSetView> {
  // Serialises two freezes of one product so each gets its own version number.
  await tx.selectFrom("products").select("id").where("id", "=", product.id).forUpdate().executeTakeFirstOrThrow();
  const computed = await computeLimits(tx, product, baseline);
  const last = await tx.selectFrom("limit_sets").select((eb) => eb.fn.max("version").as("v")).where("product_id", "=", product.id).executeTakeFirst();
  const version = Number(last?.v ?? 0) + 1;
  const inForceFrom = await resolveInForceFrom(tx, computed.lotIds, baseline.inForceFrom);
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
      in_force_from: inForceFrom,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
  await recordAudit(tx, scope, "limits.frozen", { type: "product", id: product.code }, { version, baseline: stored, waferCount: computed.waferCount });
  return toLimitSetView(row);
}
