import { type Kysely, sql } from "kysely";
import { enableTenantRls } from "./lib/rls";

// Identity and tenancy. Global tables (users, sessions, sign-in attempts, security events, password resets) hold
// no tenant data. Every tenant table carries tenant_id and a FORCEd row-level security policy keyed on the
// per-transaction setting app.tenant_id; a few named, narrow exceptions let a user see their own memberships and
// let a token or key prefix find its row before any tenant is known.

export async function up(db: Kysely<any>): Promise<void> {
  // After a commit a pooled connection reports '' rather than NULL for a custom setting: nullif keeps the cast safe.
  await sql`create function app_tenant_id() returns uuid language sql stable as $$ select nullif(current_setting('app.tenant_id', true), '')::uuid $$`.execute(db);
  await sql`create function app_customer_id() returns uuid language sql stable as $$ select nullif(current_setting('app.customer_id', true), '')::uuid $$`.execute(db);
  await sql`create function app_user_id() returns uuid language sql stable as $$ select nullif(current_setting('app.user_id', true), '')::uuid $$`.execute(db);
  await sql`create function app_setting(name text) returns text language sql stable as $$ select nullif(current_setting(name, true), '') $$`.execute(db);

  await db.schema
    .createTable("users")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("email", "text", (c) => c.notNull())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("password_hash", "text")
    .addColumn("password_changed_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await sql`create unique index users_email_key on users (lower(email))`.execute(db);

  await db.schema
    .createTable("user_sessions")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("expires_at", "timestamptz", (c) => c.notNull())
    .addColumn("active_tenant_id", "uuid", (c) => c.references("tenants.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("user_sessions_user_idx").on("user_sessions").column("user_id").execute();

  await db.schema
    .createTable("customers")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "uuid", (c) => c.notNull().defaultTo(sql`gen_random_uuid()`))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("customers_pkey", ["tenant_id", "id"])
    .addUniqueConstraint("customers_name_key", ["tenant_id", "name"])
    .execute();
  await db.schema.createIndex("customers_id_idx").on("customers").column("id").unique().execute();

  await db.schema
    .createTable("memberships")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("role", "text", (c) => c.notNull().check(sql`role in ('admin', 'engineer', 'analyst', 'customer')`))
    .addColumn("customer_id", "uuid")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("memberships_pkey", ["tenant_id", "user_id"])
    .addForeignKeyConstraint("memberships_customer_fk", ["tenant_id", "customer_id"], "customers", ["tenant_id", "id"])
    .addCheckConstraint("memberships_customer_role", sql`(role = 'customer') = (customer_id is not null)`)
    .execute();
  await db.schema.createIndex("memberships_user_idx").on("memberships").column("user_id").execute();

  await db.schema
    .createTable("invitations")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("email", "text", (c) => c.notNull())
    .addColumn("role", "text", (c) => c.notNull().check(sql`role in ('admin', 'engineer', 'analyst', 'customer')`))
    .addColumn("customer_id", "uuid")
    .addColumn("token_hash", "text", (c) => c.notNull().unique())
    .addColumn("invited_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("expires_at", "timestamptz", (c) => c.notNull())
    .addColumn("accepted_at", "timestamptz")
    .addColumn("revoked_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addForeignKeyConstraint("invitations_customer_fk", ["tenant_id", "customer_id"], "customers", ["tenant_id", "id"])
    .execute();
  await db.schema.createIndex("invitations_tenant_idx").on("invitations").columns(["tenant_id", "created_at"]).execute();

  await db.schema
    .createTable("api_keys")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("role", "text", (c) => c.notNull().check(sql`role in ('admin', 'engineer', 'analyst', 'customer')`))
    .addColumn("customer_id", "uuid")
    .addColumn("prefix", "text", (c) => c.notNull().unique())
    .addColumn("secret_hash", "text", (c) => c.notNull())
    .addColumn("created_by", "uuid", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("last_used_at", "timestamptz")
    .addColumn("revoked_at", "timestamptz")
    .addForeignKeyConstraint("api_keys_customer_fk", ["tenant_id", "customer_id"], "customers", ["tenant_id", "id"])
    .addCheckConstraint("api_keys_customer_role", sql`(role = 'customer') = (customer_id is not null)`)
    .execute();
  await db.schema.createIndex("api_keys_tenant_idx").on("api_keys").columns(["tenant_id", "created_at"]).execute();

  await db.schema
    .createTable("audit_events")
    .addColumn("tenant_id", "uuid", (c) => c.notNull().references("tenants.id").onDelete("cascade"))
    .addColumn("id", "bigserial", (c) => c.primaryKey())
    .addColumn("at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("actor_user_id", "uuid")
    .addColumn("actor_label", "text", (c) => c.notNull())
    .addColumn("action", "text", (c) => c.notNull())
    .addColumn("subject_type", "text", (c) => c.notNull())
    .addColumn("subject_id", "text", (c) => c.notNull())
    .addColumn("details", "jsonb", (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .execute();
  await db.schema.createIndex("audit_events_tenant_idx").on("audit_events").columns(["tenant_id", "subject_type", "subject_id", "at"]).execute();

  // Sign-in events belong to no tenant (the e-mail may not even exist).
  await db.schema
    .createTable("security_events")
    .addColumn("id", "bigserial", (c) => c.primaryKey())
    .addColumn("at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("kind", "text", (c) => c.notNull())
    .addColumn("email", "text")
    .addColumn("user_id", "uuid")
    .addColumn("address", "text")
    .addColumn("success", "boolean", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("security_events_email_idx").on("security_events").columns(["email", "at"]).execute();
  await db.schema.createIndex("security_events_address_idx").on("security_events").columns(["address", "at"]).execute();

  await db.schema
    .createTable("password_resets")
    .addColumn("id", "uuid", (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("user_id", "uuid", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("token_hash", "text", (c) => c.notNull().unique())
    .addColumn("expires_at", "timestamptz", (c) => c.notNull())
    .addColumn("used_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  // The transactional outbox: written in the same transaction as the event it announces.
  await db.schema
    .createTable("outbound_emails")
    .addColumn("id", "bigserial", (c) => c.primaryKey())
    .addColumn("tenant_id", "uuid", (c) => c.references("tenants.id").onDelete("cascade"))
    .addColumn("kind", "text", (c) => c.notNull())
    .addColumn("to_address", "text", (c) => c.notNull())
    .addColumn("subject", "text", (c) => c.notNull())
    .addColumn("text_body", "text", (c) => c.notNull())
    .addColumn("html_body", "text")
    .addColumn("status", "text", (c) => c.notNull().defaultTo("pending").check(sql`status in ('pending', 'sent', 'failed')`))
    .addColumn("attempts", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("next_attempt_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("last_error", "text")
    .addColumn("created_at", "timestamptz", (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn("sent_at", "timestamptz")
    .execute();
  await db.schema.createIndex("outbound_emails_pending_idx").on("outbound_emails").columns(["status", "next_attempt_at"]).execute();

  await enableTenantRls(db, "customers");
  await enableTenantRls(db, "memberships", " or user_id = app_user_id()");
  await enableTenantRls(db, "invitations", " or token_hash = app_setting('app.invitation_token_hash')");
  await enableTenantRls(db, "api_keys", " or prefix = app_setting('app.api_key_prefix')");
  await enableTenantRls(db, "audit_events");

  // The outbox: a tenant's mail is visible in its scope; only the sender (app.mail_sender) sees every message.
  await sql`alter table outbound_emails enable row level security`.execute(db);
  await sql`alter table outbound_emails force row level security`.execute(db);
  await sql`create policy outbox_access on outbound_emails using (tenant_id is null or tenant_id = app_tenant_id() or app_setting('app.mail_sender') = 'on') with check (tenant_id is null or tenant_id = app_tenant_id() or app_setting('app.mail_sender') = 'on')`.execute(db);

  // A tenant is visible when it is the current one or one the signed-in user belongs to.
  await sql`alter table tenants enable row level security`.execute(db);
  await sql`alter table tenants force row level security`.execute(db);
  await sql`create policy tenant_visibility on tenants using (id = app_tenant_id() or id in (select tenant_id from memberships where user_id = app_user_id()))`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop policy tenant_visibility on tenants`.execute(db);
  await sql`alter table tenants no force row level security`.execute(db);
  await sql`alter table tenants disable row level security`.execute(db);
  for (const table of ["outbound_emails", "password_resets", "security_events", "audit_events", "api_keys", "invitations", "memberships", "customers", "user_sessions", "users"]) {
    await db.schema.dropTable(table).execute();
  }
  for (const fn of ["app_setting(text)", "app_user_id()", "app_customer_id()", "app_tenant_id()"]) await sql.raw(`drop function ${fn}`).execute(db);
}
