import "server-only";
import { type Kysely, sql } from "kysely";
import type { LotDetail, LotFilters, LotListItem, LotStatus, WaferSummary } from "@/lib/schemas/lots";
import { AppError } from "../../http/errors";
import type { Database } from "../schema";
import { openExcursionsForLot } from "./excursions";

const ratio = (pass: number, tested: number) => (tested > 0 ? pass / tested : null);

function lotQuery(tx: Kysely<Database>) {
  return tx
    .selectFrom("lots as l")
    .innerJoin("products as p", (j) => j.onRef("p.tenant_id", "=", "l.tenant_id").onRef("p.id", "=", "l.product_id"))
    .leftJoin("customers as c", (j) => j.onRef("c.tenant_id", "=", "l.tenant_id").onRef("c.id", "=", "l.customer_id"))
    .select([
      "l.id", "l.lot_number", "p.code as product", "l.customer_id", "c.name as customer", "l.status", "l.chuck_temperature_k", "l.station",
      "l.probed_at", "l.tested", "l.pass", "l.median_conductance_s", "l.out_of_window", "l.attributes", "l.status_changed_at", "l.released_at",
    ])
    .select((eb) => eb.selectFrom("wafers as w").whereRef("w.tenant_id", "=", "l.tenant_id").whereRef("w.lot_id", "=", "l.id").select(eb.fn.countAll<string>().as("n")).as("wafer_count"));
}

type LotRow = Awaited<ReturnType<ReturnType<typeof lotQuery>["executeTakeFirstOrThrow"]>>;

function toListItem(r: LotRow): LotListItem {
  return {
    lot: r.lot_number,
    product: r.product,
    customerId: r.customer_id,
    customer: r.customer,
    status: r.status as LotStatus,
    chuckTemperatureK: r.chuck_temperature_k,
    station: r.station,
    probedAt: r.probed_at.toISOString(),
    wafers: Number(r.wafer_count ?? 0),
    tested: r.tested,
    pass: r.pass,
    yield: ratio(r.pass, r.tested),
    medianConductanceS: r.median_conductance_s,
    outOfWindow: r.out_of_window,
  };
}

/** Lots in the caller's reach (row-level security keeps a customer to its released lots), filtered and paged. */
export async function listLots(tx: Kysely<Database>, filters: LotFilters): Promise<{ lots: LotListItem[]; page: number; pageSize: number; total: number }> {
  let q = lotQuery(tx);
  if (filters.product) q = q.where("p.code", "=", filters.product);
  if (filters.status) q = q.where("l.status", "=", filters.status);
  if (filters.from) q = q.where("l.probed_at", ">=", new Date(filters.from));
  if (filters.to) q = q.where("l.probed_at", "<=", new Date(filters.to));
  if (filters.customer) q = q.where("l.customer_id", "=", filters.customer);
  if (filters.q) q = q.where("l.lot_number", "ilike", `%${filters.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`);
  const total = await q.clearSelect().select((eb) => eb.fn.countAll<string>().as("n")).executeTakeFirstOrThrow();
  const sortColumn = filters.sort === "lot" ? "l.lot_number" : filters.sort === "yield" ? sql`(l.pass::float8 / nullif(l.tested, 0))` : "l.probed_at";
  const rows = await q
    .orderBy(sortColumn as never, filters.order)
    .orderBy("l.lot_number")
    .limit(filters.pageSize)
    .offset((filters.page - 1) * filters.pageSize)
    .execute();
  return { lots: rows.map(toListItem), page: filters.page, pageSize: filters.pageSize, total: Number(total.n) };
}

export async function findLotId(tx: Kysely<Database>, lotNumber: string): Promise<string> {
  const row = await tx.selectFrom("lots").select("id").where("lot_number", "=", lotNumber).executeTakeFirst();
  if (!row) throw new AppError("not_found", `Lot ${lotNumber} not found`);
  return row.id;
}

export async function listWafers(tx: Kysely<Database>, lotId: string): Promise<WaferSummary[]> {
  const rows = await tx.selectFrom("wafers").selectAll().where("lot_id", "=", lotId).orderBy("slot").execute();
  return rows.map((w) => ({
    wafer: w.slot,
    tested: w.tested,
    pass: w.pass,
    yield: ratio(w.pass, w.tested),
    medianConductanceS: w.median_conductance_s,
    outOfWindow: w.out_of_window,
    inked: w.inked,
    bins: w.bin_counts as Record<string, number>,
    windowLowS: w.window_low_s,
    windowHighS: w.window_high_s,
    probedAt: w.probed_at.toISOString(),
  }));
}

/** The §9 lot summary. */
export async function getLotDetail(tx: Kysely<Database>, lotNumber: string): Promise<LotDetail & { id: string }> {
  const row = await lotQuery(tx).where("l.lot_number", "=", lotNumber).executeTakeFirst();
  if (!row) throw new AppError("not_found", `Lot ${lotNumber} not found`);
  const wafers = await listWafers(tx, row.id);
  const bins: Record<string, number> = {};
  for (const w of wafers) for (const [bin, n] of Object.entries(w.bins)) bins[bin] = (bins[bin] ?? 0) + n;
  const { wafers: _count, ...item } = toListItem(row);
  return {
    ...item,
    id: row.id,
    attributes: row.attributes as Record<string, string>,
    wafers,
    bins,
    statusChangedAt: row.status_changed_at.toISOString(),
    releasedAt: row.released_at?.toISOString() ?? null,
    openExcursions: (await openExcursionsForLot(tx, row.id)).map((e) => ({ id: e.id, title: e.title, openedAt: e.openedAt })),
  };
}
