import { type Kysely, sql } from "kysely";
import { enableTenantRls } from "./lib/rls";

// Products, raw files, ingest jobs, lots, wafers and dies (§3–§5).
// A customer (app.customer_id set) sees only its own products and only its released lots, with their wafers and
// dies; raw files and jobs are staff-only. The job runner (app.job_runner) may claim any tenant's queued job.

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("products")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "uuid", (c) => c.notNull().defaultTo(sql`gen_random_uuid()`))
    .addColumn("code", "text", (c) => c.notNull())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("customer_id", "uuid")
    .addColumn("die_width_mm", "double precision", (c) => c.notNull())
    .addColumn("die_height_mm", "double precision", (c) => c.notNull())
    .addColumn("wafer_diameter_mm", "double precision", (c) => c.notNull())
    .addColumn("edge_exclusion_mm", "double precision", (c) => c.notNull().defaultTo(3))
    .addColumn("spec_low_s", "double precision")
    .addColumn("spec_high_s", "double precision")
    .addColumn("window_factor", "double precision", (c) => c.notNull().defaultTo(0.5))
    .addColumn("nonlinearity_max", "double precision", (c) => c.notNull().defaultTo(0.02))
    .addColumn("open_below_s", "double precision")
    .addColumn("short_above_s", "double precision")
    .addColumn("yield_floor", "double precision")
    .addColumn("rules", "text", (c) => c.notNull().defaultTo("western-electric").check(sql`rules in ('western-electric', 'nelson')`))
    .addColumn("die_window", "text", (c) => c.notNull().defaultTo("pat").check(sql`die_window in ('static', 'pat')`))
    .addColumn("die_window_k", "double precision")
    .addColumn("display_unit", "text", (c) => c.notNull().defaultTo("uS").check(sql`display_unit in ('S', 'uS', 'G0')`))
    .addColumn("device_model", "jsonb")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("products_pkey", ["tenant_id", "id"])
    .addUniqueConstraint("products_code_key", ["tenant_id", "code"])
    .addForeignKeyConstraint("products_customer_fk", ["tenant_id", "customer_id"], "customers", ["tenant_id", "id"])
    .execute();

  await db.schema
    .createTable("raw_files")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "uuid", (c) => c.notNull().defaultTo(sql`gen_random_uuid()`))
    .addColumn("sha256", "text", (c) => c.notNull())
    .addColumn("size_bytes", "bigint", (c) => c.notNull())
    .addColumn("object_key", "text", (c) => c.notNull())
    .addColumn("file_name", "text")
    .addColumn("uploaded_by", "text", (c) => c.notNull())
    .addColumn("uploaded_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("raw_files_pkey", ["tenant_id", "id"])
    .addUniqueConstraint("raw_files_sha_key", ["tenant_id", "sha256"])
    .execute();

  await db.schema
    .createTable("ingest_jobs")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "uuid", (c) => c.notNull().defaultTo(sql`gen_random_uuid()`))
    .addColumn("raw_file_id", "uuid", (c) => c.notNull())
    .addColumn("status", "text", (c) => c.notNull().defaultTo("queued").check(sql`status in ('queued', 'running', 'done', 'failed')`))
    .addColumn("progress", "double precision", (c) => c.notNull().defaultTo(0))
    .addColumn("lot_number", "text")
    .addColumn("product_code", "text")
    .addColumn("chuck_temperature_k", "double precision")
    .addColumn("attempts", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("run_after", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("lease_until", "timestamptz")
    .addColumn("started_at", "timestamptz")
    .addColumn("finished_at", "timestamptz")
    .addColumn("error_code", "text")
    .addColumn("error_line", "integer")
    .addColumn("error_message", "text")
    .addColumn("warnings", "jsonb", (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn("report", "jsonb")
    .addColumn("created_by", "text", (c) => c.notNull())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("ingest_jobs_pkey", ["tenant_id", "id"])
    .addUniqueConstraint("ingest_jobs_raw_file_key", ["tenant_id", "raw_file_id"])
    .addForeignKeyConstraint("ingest_jobs_raw_file_fk", ["tenant_id", "raw_file_id"], "raw_files", ["tenant_id", "id"])
    .execute();
  await db.schema.createIndex("ingest_jobs_id_idx").on("ingest_jobs").column("id").unique().execute();
  await db.schema.createIndex("ingest_jobs_claim_idx").on("ingest_jobs").columns(["status", "run_after"]).execute();
  await db.schema.createIndex("ingest_jobs_tenant_created_idx").on("ingest_jobs").columns(["tenant_id", "created_at"]).execute();

  await db.schema
    .createTable("lots")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "uuid", (c) => c.notNull().defaultTo(sql`gen_random_uuid()`))
    .addColumn("lot_number", "text", (c) => c.notNull())
    .addColumn("product_id", "uuid", (c) => c.notNull())
    .addColumn("customer_id", "uuid")
    .addColumn("status", "text", (c) => c.notNull().defaultTo("receiving").check(sql`status in ('receiving', 'probed', 'on hold', 'released', 'scrapped')`))
    .addColumn("chuck_temperature_k", "double precision", (c) => c.notNull())
    .addColumn("station", "text")
    .addColumn("probed_at", "timestamptz", (c) => c.notNull())
    .addColumn("attributes", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn("tested", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("pass", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("out_of_window", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("median_conductance_s", "double precision")
    .addColumn("last_job_id", "uuid")
    .addColumn("status_changed_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("released_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("lots_pkey", ["tenant_id", "id"])
    .addUniqueConstraint("lots_number_key", ["tenant_id", "lot_number"])
    .addForeignKeyConstraint("lots_product_fk", ["tenant_id", "product_id"], "products", ["tenant_id", "id"])
    .execute();
  await db.schema.createIndex("lots_tenant_probed_idx").on("lots").columns(["tenant_id", "probed_at"]).execute();
  await db.schema.createIndex("lots_tenant_product_idx").on("lots").columns(["tenant_id", "product_id", "probed_at"]).execute();

  await db.schema
    .createTable("wafers")
    .addColumn("tenant_id", "uuid", (c) => c.notNull())
    .addColumn("lot_id", "uuid", (c) => c.notNull())
    .addColumn("slot", "integer", (c) => c.notNull().check(sql`slot between 1 and 25`))
    .addColumn("tested", "integer", (c) => c.notNull())
    .addColumn("pass", "integer", (c) => c.notNull())
    .addColumn("inked", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("out_of_window", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("median_conductance_s", "double precision")
    .addColumn("bin_counts", "jsonb", (c) => c.notNull())
    .addColumn("window_low_s", "double precision")
    .addColumn("window_high_s", "double precision")
    .addColumn("job_id", "uuid", (c) => c.notNull())
    .addColumn("probed_at", "timestamptz", (c) => c.notNull())
    .addPrimaryKeyConstraint("wafers_pkey", ["tenant_id", "lot_id", "slot"])
    .addForeignKeyConstraint("wafers_lot_fk", ["tenant_id", "lot_id"], "lots", ["tenant_id", "id"], (fk) => fk.onDelete("cascade"))
    .execute();

  await db.schema
    .createTable("dies")
    .addColumn("tenant_id", "uuid", (c) => c.notNull())
    .addColumn("lot_id", "uuid", (c) => c.notNull())
    .addColumn("wafer_slot", "integer", (c) => c.notNull())
    .addColumn("x", "integer", (c) => c.notNull())
    .addColumn("y", "integer", (c) => c.notNull())
    .addColumn("conductance_s", "double precision")
    .addColumn("offset_a", "double precision")
    .addColumn("r2", "double precision")
    .addColumn("points_in_window", "integer", (c) => c.notNull())
    .addColumn("window_v", "double precision", (c) => c.notNull())
    .addColumn("nonlinearity", "double precision")
    .addColumn("nonlinearity_window_only", "boolean", (c) => c.notNull())
    .addColumn("modes", "double precision")
    .addColumn("bin", "text", (c) => c.notNull())
    .addColumn("reason", "text")
    .addColumn("temperature_k", "double precision", (c) => c.notNull())
    .addColumn("site", "text")
    .addColumn("out_of_window", "boolean", (c) => c.notNull().defaultTo(false))
    .addColumn("inked", "boolean", (c) => c.notNull().defaultTo(false))
    .addColumn("points", "integer", (c) => c.notNull())
    // The sweep, compactly: little-endian float64 triples (bias V, current A, compliance 0/1) per point.
    .addColumn("sweep", "bytea", (c) => c.notNull())
    .addPrimaryKeyConstraint("dies_pkey", ["tenant_id", "lot_id", "wafer_slot", "x", "y"])
    .addForeignKeyConstraint("dies_wafer_fk", ["tenant_id", "lot_id", "wafer_slot"], "wafers", ["tenant_id", "lot_id", "slot"], (fk) => fk.onDelete("cascade"))
    .execute();

  await enableTenantRls(db, "products", "");
  await sql`create policy customer_products on products as restrictive using (app_customer_id() is null or customer_id = app_customer_id())`.execute(db);
  await enableTenantRls(db, "raw_files");
  await sql`create policy staff_only on raw_files as restrictive using (app_customer_id() is null)`.execute(db);
  await sql`alter table ingest_jobs enable row level security`.execute(db);
  await sql`alter table ingest_jobs force row level security`.execute(db);
  await sql`create policy tenant_isolation on ingest_jobs
    using (tenant_id = app_tenant_id() or app_setting('app.job_runner') = 'on')
    with check (tenant_id = app_tenant_id() or app_setting('app.job_runner') = 'on')`.execute(db);
  await sql`create policy staff_only on ingest_jobs as restrictive using (app_customer_id() is null)`.execute(db);
  await enableTenantRls(db, "lots");
  await sql`create policy customer_lots on lots as restrictive using (app_customer_id() is null or (customer_id = app_customer_id() and status = 'released'))`.execute(db);
  for (const table of ["wafers", "dies"]) {
    await enableTenantRls(db, table);
    await sql
      .raw(`create policy customer_${table} on ${table} as restrictive using (app_customer_id() is null or exists (select 1 from lots l where l.tenant_id = ${table}.tenant_id and l.id = ${table}.lot_id))`)
      .execute(db);
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ["dies", "wafers", "lots", "ingest_jobs", "raw_files", "products"]) await db.schema.dropTable(table).execute();
}
