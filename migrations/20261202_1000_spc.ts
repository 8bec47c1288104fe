import { type Kysely, sql } from "kysely";
import { enableTenantRls } from "./lib/rls";

// Statistical process control (§6): frozen limit sets per product, excursions with their lots and comments,
// lot dispositions and product watch lists. None of it is ever visible to a customer (§2): each table gets a
// restrictive staff-only policy on top of the tenant policy.

const STAFF_ONLY_TABLES = ["limit_sets", "excursions", "excursion_lots", "excursion_comments", "lot_dispositions", "product_watchers"];

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("limit_sets")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "uuid", (c) => c.notNull().defaultTo(sql`gen_random_uuid()`))
    .addColumn("product_id", "uuid", (c) => c.notNull())
    .addColumn("version", "integer", (c) => c.notNull().check(sql`version >= 1`))
    // {kind: "lots", lots: [...]} or {kind: "dates", from, to}, plus the lot numbers that entered.
    .addColumn("baseline", "jsonb", (c) => c.notNull())
    // The domain's BaselineLimitValues: individuals and X̄–S limits for wafer median G (S) and wafer yield (0–1).
    .addColumn("limits", "jsonb", (c) => c.notNull())
    .addColumn("lot_count", "integer", (c) => c.notNull())
    .addColumn("wafer_count", "integer", (c) => c.notNull())
    .addColumn("die_count", "integer", (c) => c.notNull())
    // Static die window (baseline median ± k·1.4826·MAD), used for products whose die window is "static".
    .addColumn("die_window_low_s", "double precision")
    .addColumn("die_window_high_s", "double precision")
    .addColumn("die_window_center_s", "double precision")
    .addColumn("die_window_sigma_s", "double precision")
    .addColumn("die_window_k", "double precision", (c) => c.notNull())
    .addColumn("rules", "text", (c) => c.notNull().check(sql`rules in ('western-electric', 'nelson')`))
    .addColumn("note", "text")
    .addColumn("frozen_by", "uuid")
    .addColumn("frozen_by_label", "text", (c) => c.notNull())
    .addColumn("frozen_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    // Lots probed from this instant on are judged against this version (normally the freeze itself).
    .addColumn("in_force_from", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("limit_sets_pkey", ["tenant_id", "id"])
    .addUniqueConstraint("limit_sets_version_key", ["tenant_id", "product_id", "version"])
    .addForeignKeyConstraint("limit_sets_product_fk", ["tenant_id", "product_id"], "products", ["tenant_id", "id"], (fk) => fk.onDelete("cascade"))
    .execute();
  await db.schema.createIndex("limit_sets_in_force_idx").on("limit_sets").columns(["tenant_id", "product_id", "in_force_from"]).execute();

  await db.schema
    .createTable("excursions")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "uuid", (c) => c.notNull().defaultTo(sql`gen_random_uuid()`))
    .addColumn("number", "integer", (c) => c.notNull())
    .addColumn("product_id", "uuid", (c) => c.notNull())
    .addColumn("trigger", "text", (c) => c.notNull().check(sql`trigger in ('rule', 'yield_floor', 'edge_ring', 'manual')`))
    .addColumn("title", "text", (c) => c.notNull())
    .addColumn("status", "text", (c) => c.notNull().defaultTo("open").check(sql`status in ('open', 'acknowledged', 'resolved')`))
    .addColumn("limit_set_id", "uuid")
    .addColumn("evidence", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn("owner_user_id", "uuid")
    .addColumn("opened_by_label", "text", (c) => c.notNull())
    .addColumn("opened_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("acknowledged_at", "timestamptz")
    .addColumn("resolved_at", "timestamptz")
    .addColumn("root_cause", "text")
    .addColumn("resolution_note", "text")
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("excursions_pkey", ["tenant_id", "id"])
    .addUniqueConstraint("excursions_number_key", ["tenant_id", "number"])
    .addForeignKeyConstraint("excursions_product_fk", ["tenant_id", "product_id"], "products", ["tenant_id", "id"], (fk) => fk.onDelete("cascade"))
    .addCheckConstraint("excursions_resolution_check", sql`status <> 'resolved' or (root_cause is not null and resolution_note is not null)`)
    .execute();
  await db.schema.createIndex("excursions_tenant_status_idx").on("excursions").columns(["tenant_id", "status", "product_id", "opened_at"]).execute();

  await db.schema
    .createTable("excursion_lots")
    .addColumn("tenant_id", "uuid", (c) => c.notNull())
    .addColumn("excursion_id", "uuid", (c) => c.notNull())
    .addColumn("lot_id", "uuid", (c) => c.notNull())
    .addColumn("wafers", sql`integer[]`, (c) => c.notNull().defaultTo(sql`'{}'::integer[]`))
    // What this lot contributed: rule hits, yield or edge figures.
    .addColumn("findings", "jsonb", (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn("added_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("excursion_lots_pkey", ["tenant_id", "excursion_id", "lot_id"])
    .addForeignKeyConstraint("excursion_lots_excursion_fk", ["tenant_id", "excursion_id"], "excursions", ["tenant_id", "id"], (fk) => fk.onDelete("cascade"))
    .addForeignKeyConstraint("excursion_lots_lot_fk", ["tenant_id", "lot_id"], "lots", ["tenant_id", "id"], (fk) => fk.onDelete("cascade"))
    .execute();
  await db.schema.createIndex("excursion_lots_lot_idx").on("excursion_lots").columns(["tenant_id", "lot_id"]).execute();

  await db.schema
    .createTable("excursion_comments")
    .addColumn("tenant_id", "uuid", (c) => c.notNull())
    .addColumn("id", "uuid", (c) => c.notNull().defaultTo(sql`gen_random_uuid()`))
    .addColumn("excursion_id", "uuid", (c) => c.notNull())
    .addColumn("author_user_id", "uuid")
    .addColumn("author_label", "text", (c) => c.notNull())
    .addColumn("body", "text", (c) => c.notNull())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("excursion_comments_pkey", ["tenant_id", "id"])
    .addForeignKeyConstraint("excursion_comments_excursion_fk", ["tenant_id", "excursion_id"], "excursions", ["tenant_id", "id"], (fk) => fk.onDelete("cascade"))
    .execute();
  await db.schema.createIndex("excursion_comments_excursion_idx").on("excursion_comments").columns(["tenant_id", "excursion_id", "created_at"]).execute();

  await db.schema
    .createTable("lot_dispositions")
    .addColumn("tenant_id", "uuid", (c) => c.notNull())
    .addColumn("id", "uuid", (c) => c.notNull().defaultTo(sql`gen_random_uuid()`))
    .addColumn("lot_id", "uuid", (c) => c.notNull())
    .addColumn("action", "text", (c) => c.notNull().check(sql`action in ('hold', 'release', 'scrap')`))
    .addColumn("from_status", "text", (c) => c.notNull())
    .addColumn("to_status", "text", (c) => c.notNull())
    .addColumn("reason", "text", (c) => c.notNull())
    .addColumn("override_reason", "text")
    .addColumn("actor_user_id", "uuid")
    .addColumn("actor_label", "text", (c) => c.notNull())
    .addColumn("at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("lot_dispositions_pkey", ["tenant_id", "id"])
    .addForeignKeyConstraint("lot_dispositions_lot_fk", ["tenant_id", "lot_id"], "lots", ["tenant_id", "id"], (fk) => fk.onDelete("cascade"))
    .execute();
  await db.schema.createIndex("lot_dispositions_lot_idx").on("lot_dispositions").columns(["tenant_id", "lot_id", "at"]).execute();

  await db.schema
    .createTable("product_watchers")
    .addColumn("tenant_id", "uuid", (c) => c.notNull())
    .addColumn("product_id", "uuid", (c) => c.notNull())
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("added_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("product_watchers_pkey", ["tenant_id", "product_id", "user_id"])
    .addForeignKeyConstraint("product_watchers_product_fk", ["tenant_id", "product_id"], "products", ["tenant_id", "id"], (fk) => fk.onDelete("cascade"))
    .execute();

  for (const table of STAFF_ONLY_TABLES) {
    await enableTenantRls(db, table);
    await sql.raw(`create policy staff_only on ${table} as restrictive using (app_customer_id() is null)`).execute(db);
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ["product_watchers", "lot_dispositions", "excursion_comments", "excursion_lots", "excursions", "limit_sets"]) {
    await db.schema.dropTable(table).execute();
  }
}
