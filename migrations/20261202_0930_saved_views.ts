import { type Kysely, sql } from "kysely";
import { enableTenantRls } from "./lib/rls";

// Saved views: a person's named URL states (a lot page with its wafer, colouring and filters), private to them.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("saved_views")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "uuid", (c) => c.notNull().defaultTo(sql`gen_random_uuid()`))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("path", "text", (c) => c.notNull())
    .addColumn("query", "text", (c) => c.notNull())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("saved_views_pkey", ["tenant_id", "id"])
    .execute();
  await db.schema.createIndex("saved_views_user_idx").on("saved_views").columns(["tenant_id", "user_id", "path"]).execute();
  await enableTenantRls(db, "saved_views");
  await sql`create policy own_views on saved_views as restrictive using (user_id = app_user_id()) with check (user_id = app_user_id())`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("saved_views").execute();
}
