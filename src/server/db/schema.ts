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

export type ProductRules = "western-electric" | "nelson";
export type DisplayUnit = "S" | "uS" | "G0";
export type LotStatus = "receiving" | "probed" | "on hold" | "released" | "scrapped";
export type JobStatus = "queued" | "running" | "done" | "failed";

export interface ProductsTable {
  tenant_id: string;
  id: Generated<string>;
  code: string;
  name: string;
  customer_id: string | null;
  die_width_mm: number;
  die_height_mm: number;
  wafer_diameter_mm: number;
  edge_exclusion_mm: Generated<number>;
  spec_low_s: number | null;
  spec_high_s: number | null;
  window_factor: Generated<number>;
  nonlinearity_max: Generated<number>;
  open_below_s: number | null;
  short_above_s: number | null;
  yield_floor: number | null;
  rules: Generated<ProductRules>;
  die_window: Generated<"static" | "pat">;
  die_window_k: number | null;
  display_unit: Generated<DisplayUnit>;
  device_model: Json | null;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface RawFilesTable {
  tenant_id: string;
  id: Generated<string>;
  sha256: string;
  size_bytes: ColumnType<string, number | string, number | string>;
  object_key: string;
  file_name: string | null;
  uploaded_by: string;
  uploaded_at: Timestamp;
}

export interface IngestJobsTable {
  tenant_id: string;
  id: Generated<string>;
  raw_file_id: string;
  status: Generated<JobStatus>;
  progress: Generated<number>;
  lot_number: string | null;
  product_code: string | null;
  chuck_temperature_k: number | null;
  attempts: Generated<number>;
  run_after: Timestamp;
  lease_until: NullableTimestamp;
  started_at: NullableTimestamp;
  finished_at: NullableTimestamp;
  error_code: string | null;
  error_line: number | null;
  error_message: string | null;
  warnings: Json;
  report: Json | null;
  created_by: string;
  created_at: Timestamp;
}

export interface LotsTable {
  tenant_id: string;
  id: Generated<string>;
  lot_number: string;
  product_id: string;
  customer_id: string | null;
  status: Generated<LotStatus>;
  chuck_temperature_k: number;
  station: string | null;
  probed_at: Timestamp;
  attributes: Json;
  tested: Generated<number>;
  pass: Generated<number>;
  out_of_window: Generated<number>;
  median_conductance_s: number | null;
  last_job_id: string | null;
  status_changed_at: Timestamp;
  released_at: NullableTimestamp;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface WafersTable {
  tenant_id: string;
  lot_id: string;
  slot: number;
  tested: number;
  pass: number;
  inked: Generated<number>;
  out_of_window: Generated<number>;
  median_conductance_s: number | null;
  bin_counts: Json;
  window_low_s: number | null;
  window_high_s: number | null;
  job_id: string;
  probed_at: Timestamp;
}

export interface DiesTable {
  tenant_id: string;
  lot_id: string;
  wafer_slot: number;
  x: number;
  y: number;
  conductance_s: number | null;
  offset_a: number | null;
  r2: number | null;
  points_in_window: number;
  window_v: number;
  nonlinearity: number | null;
  nonlinearity_window_only: boolean;
  modes: number | null;
  bin: string;
  reason: string | null;
  temperature_k: number;
  site: string | null;
  out_of_window: Generated<boolean>;
  inked: Generated<boolean>;
  points: number;
  sweep: Buffer;
}

export interface SavedViewsTable {
  tenant_id: string;
  id: Generated<string>;
  user_id: string;
  name: string;
  path: string;
  query: string;
  created_at: Timestamp;
}

export type ExcursionStatus = "open" | "acknowledged" | "resolved";
export type ExcursionTrigger = "rule" | "yield_floor" | "edge_ring" | "manual";
export type DispositionAction = "hold" | "release" | "scrap";

export interface LimitSetsTable {
  tenant_id: string;
  id: Generated<string>;
  product_id: string;
  version: number;
  baseline: Json;
  limits: Json;
  lot_count: number;
  wafer_count: number;
  die_count: number;
  die_window_low_s: number | null;
  die_window_high_s: number | null;
  die_window_center_s: number | null;
  die_window_sigma_s: number | null;
  die_window_k: number;
  rules: ProductRules;
  note: string | null;
  frozen_by: string | null;
  frozen_by_label: string;
  frozen_at: Timestamp;
  in_force_from: Timestamp;
}

export interface ExcursionsTable {
  tenant_id: string;
  id: Generated<string>;
  number: number;
  product_id: string;
  trigger: ExcursionTrigger;
  title: string;
  status: Generated<ExcursionStatus>;
  limit_set_id: string | null;
  evidence: Json;
  owner_user_id: string | null;
  opened_by_label: string;
  opened_at: Timestamp;
  acknowledged_at: NullableTimestamp;
  resolved_at: NullableTimestamp;
  root_cause: string | null;
  resolution_note: string | null;
  updated_at: Timestamp;
}

export interface ExcursionLotsTable {
  tenant_id: string;
  excursion_id: string;
  lot_id: string;
  wafers: ColumnType<number[], number[] | undefined, number[]>;
  findings: Json;
  added_at: Timestamp;
}

export interface ExcursionCommentsTable {
  tenant_id: string;
  id: Generated<string>;
  excursion_id: string;
  author_user_id: string | null;
  author_label: string;
  body: string;
  created_at: Timestamp;
}

export interface LotDispositionsTable {
  tenant_id: string;
  id: Generated<string>;
  lot_id: string;
  action: DispositionAction;
  from_status: LotStatus;
  to_status: LotStatus;
  reason: string;
  override_reason: string | null;
  actor_user_id: string | null;
  actor_label: string;
  at: Timestamp;
}

export interface ProductWatchersTable {
  tenant_id: string;
  product_id: string;
  user_id: string;
  added_at: Timestamp;
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
  products: ProductsTable;
  raw_files: RawFilesTable;
  ingest_jobs: IngestJobsTable;
  lots: LotsTable;
  wafers: WafersTable;
  dies: DiesTable;
  saved_views: SavedViewsTable;
  limit_sets: LimitSetsTable;
  excursions: ExcursionsTable;
  excursion_lots: ExcursionLotsTable;
  excursion_comments: ExcursionCommentsTable;
  lot_dispositions: LotDispositionsTable;
  product_watchers: ProductWatchersTable;
}
