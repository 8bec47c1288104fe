import "server-only";
import type { Kysely, Selectable } from "kysely";
import { type CreateProduct, defaultDieWindowK, type DeviceModelInput, type PatchProduct, type Product } from "@/lib/schemas/products";
import { AppError } from "../../http/errors";
import type { Scope } from "../scope";
import type { Database, ProductsTable } from "../schema";
import { recordAudit } from "./audit";

type Row = Selectable<ProductsTable> & { customer_name: string | null };

export function toProduct(r: Row): Product {
  return {
    code: r.code,
    name: r.name,
    customerId: r.customer_id,
    customerName: r.customer_name,
    dieWidthMm: r.die_width_mm,
    dieHeightMm: r.die_height_mm,
    waferDiameterMm: r.wafer_diameter_mm,
    edgeExclusionMm: r.edge_exclusion_mm,
    specLowS: r.spec_low_s,
    specHighS: r.spec_high_s,
    windowFactor: r.window_factor,
    nonlinearityMax: r.nonlinearity_max,
    openBelowS: r.open_below_s,
    shortAboveS: r.short_above_s,
    yieldFloor: r.yield_floor,
    rules: r.rules,
    dieWindow: r.die_window,
    dieWindowK: r.die_window_k ?? defaultDieWindowK(r.die_window),
    displayUnit: r.display_unit,
    deviceModel: (r.device_model as DeviceModelInput | null) ?? null,
    updatedAt: r.updated_at.toISOString(),
  };
}

function baseQuery(tx: Kysely<Database>) {
  return tx
    .selectFrom("products as p")
    .leftJoin("customers as c", (j) => j.onRef("c.tenant_id", "=", "p.tenant_id").onRef("c.id", "=", "p.customer_id"))
    .selectAll("p")
    .select("c.name as customer_name");
}

export async function listProducts(tx: Kysely<Database>): Promise<Product[]> {
  return (await baseQuery(tx).orderBy("p.code").execute()).map(toProduct);
}

/** A product with its row id (for joins), or null when it is not in the caller's reach. */
export async function findProduct(tx: Kysely<Database>, code: string): Promise<(Product & { id: string }) | null> {
  const row = await baseQuery(tx).where("p.code", "=", code).executeTakeFirst();
  return row ? { ...toProduct(row), id: row.id } : null;
}

export async function getProduct(tx: Kysely<Database>, code: string): Promise<Product & { id: string }> {
  const product = await findProduct(tx, code);
  if (!product) throw new AppError("not_found", `Product ${code} not found`);
  return product;
}

function columns(input: PatchProduct) {
  const set: Partial<Record<keyof ProductsTable, unknown>> = {};
  const map: [keyof PatchProduct, keyof ProductsTable][] = [
    ["name", "name"], ["customerId", "customer_id"], ["dieWidthMm", "die_width_mm"], ["dieHeightMm", "die_height_mm"],
    ["waferDiameterMm", "wafer_diameter_mm"], ["edgeExclusionMm", "edge_exclusion_mm"], ["specLowS", "spec_low_s"],
    ["specHighS", "spec_high_s"], ["windowFactor", "window_factor"], ["nonlinearityMax", "nonlinearity_max"],
    ["openBelowS", "open_below_s"], ["shortAboveS", "short_above_s"], ["yieldFloor", "yield_floor"], ["rules", "rules"],
    ["dieWindow", "die_window"], ["dieWindowK", "die_window_k"], ["displayUnit", "display_unit"],
  ];
  for (const [from, to] of map) if (input[from] !== undefined) set[to] = input[from];
  if (input.deviceModel !== undefined) set.device_model = input.deviceModel === null ? null : JSON.stringify(input.deviceModel);
  return set;
}

async function assertCustomer(tx: Kysely<Database>, customerId: string | null | undefined) {
  if (!customerId) return;
  const found = await tx.selectFrom("customers").select("id").where("id", "=", customerId).executeTakeFirst();
  if (!found) throw new AppError("unprocessable", "customerId: no such customer in this tenant", [{ path: "customerId", message: "no such customer" }]);
}

export async function createProduct(tx: Kysely<Database>, scope: Scope, input: CreateProduct): Promise<Product> {
  await assertCustomer(tx, input.customerId);
  if (await findProduct(tx, input.code)) throw new AppError("conflict", `Product ${input.code} already exists`);
  const { code, ...rest } = input;
  await tx.insertInto("products").values({ tenant_id: scope.tenantId, code, ...(columns(rest) as object) } as never).execute();
  await recordAudit(tx, scope, "product.created", { type: "product", id: code }, input);
  return getProduct(tx, code);
}

export async function updateProduct(tx: Kysely<Database>, scope: Scope, code: string, input: PatchProduct): Promise<Product> {
  const before = await getProduct(tx, code);
  await assertCustomer(tx, input.customerId);
  const merged = { ...before, ...input };
  if (merged.specLowS != null && merged.specHighS != null && merged.specLowS >= merged.specHighS) {
    throw new AppError("unprocessable", "specHighS must be above specLowS", [{ path: "specHighS", message: "must be above specLowS" }]);
  }
  const set = columns(input);
  if (Object.keys(set).length) await tx.updateTable("products").set({ ...(set as object), updated_at: new Date() }).where("code", "=", code).execute();
  await recordAudit(tx, scope, "product.updated", { type: "product", id: code }, input);
  return getProduct(tx, code);
}
