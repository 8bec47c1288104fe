import type { ColumnType, Generated } from "kysely";

// The Database interface: one XxxTable per table. Changes in the same commit as its migration.
/** A timestamptz; optional on insert where the column has a default. */
type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
type NullableTimestamp = ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
type Json = ColumnType<unknown, string | undefined, string>;
/** bigserial: pg returns int8 as a string. */
type BigId = ColumnType<string, never, never>;

export type Role = "admin" | "engineer" | "analyst" | "customer";

export interface TenantsTable {
  id: Generated<string>;
  slug: string;
  name: string;
  error_budget_fraction: Generated<number>;
  created_at: Timestamp;
}

export interface UsersTable {
  id: Generated<string>;
  email: string;
  name: string;
  password_hash: string | null;
  password_changed_at: NullableTimestamp;
  created_at: Timestamp;
}

export interface UserSessionsTable {
  id: string;
  user_id: string;
  expires_at: Timestamp;
  active_tenant_id: string | null;
  created_at: Timestamp;
}

export interface CustomersTable {
  tenant_id: string;
  id: Generated<string>;
  name: string;
  created_at: Timestamp;
}

export interface MembershipsTable {
  tenant_id: string;
  user_id: string;
  role: Role;
  customer_id: string | null;
  created_at: Timestamp;
}

export interface InvitationsTable {
  tenant_id: string;
  id: Generated<string>;
  email: string;
  role: Role;
  customer_id: string | null;
  token_hash: string;
  invited_by: string | null;
  expires_at: Timestamp;
  accepted_at: NullableTimestamp;
  revoked_at: NullableTimestamp;
  created_at: Timestamp;
}

export interface ApiKeysTable {
  tenant_id: string;
  id: Generated<string>;
  name: string;
  role: Role;
  customer_id: string | null;
  prefix: string;
  secret_hash: string;
  created_by: string | null;
  created_at: Timestamp;
  last_used_at: NullableTimestamp;
  revoked_at: NullableTimestamp;
}

export interface AuditEventsTable {
  tenant_id: string;
  id: BigId;
  at: Timestamp;
  actor_user_id: string | null;
  actor_label: string;
  action: string;
  subject_type: string;
  subject_id: string;
  details: Json;
}

export interface SecurityEventsTable {
  id: BigId;
  at: Timestamp;
  kind: string;
  email: string | null;
  user_id: string | null;
  address: string | null;
  success: boolean;
}

export interface PasswordResetsTable {
  id: Generated<string>;
  user_id: string;
  token_hash: string;
  expires_at: Timestamp;
  used_at: NullableTimestamp;
  created_at: Timestamp;
}

export interface OutboundEmailsTable {
  id: BigId;
  tenant_id: string | null;
  kind: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  status: Generated<"pending" | "sent" | "failed">;
  attempts: Generated<number>;
  next_attempt_at: Timestamp;
  last_error: string | null;
  created_at: Timestamp;
  sent_at: NullableTimestamp;
}

export interface Database {
  tenants: TenantsTable;
  users: UsersTable;
  user_sessions: UserSessionsTable;
  customers: CustomersTable;
  memberships: MembershipsTable;
  invitations: InvitationsTable;
  api_keys: ApiKeysTable;
  audit_events: AuditEventsTable;
  security_events: SecurityEventsTable;
  password_resets: PasswordResetsTable;
  outbound_emails: OutboundEmailsTable;
}
