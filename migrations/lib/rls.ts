import { type Kysely, sql } from "kysely";

// Shared by migrations, so frozen like them: write a new helper rather than change this one.
/** Row-level security, FORCEd so even the table owner obeys it, keyed on the per-transaction app.tenant_id. */
export async function enableTenantRls(db: Kysely<any>, table: string, extraVisibility = ""): Promise<void> {
  await sql`alter table ${sql.table(table)} enable row level security`.execute(db);
  await sql`alter table ${sql.table(table)} force row level security`.execute(db);
  await sql
    .raw(`create policy tenant_isolation on ${table} using (tenant_id = app_tenant_id()${extraVisibility}) with check (tenant_id = app_tenant_id())`)
    .execute(db);
}
