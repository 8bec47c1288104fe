import type { ColumnType, Generated } from "kysely";

// The Database interface: one XxxTable per table. Changes in the same commit as its migration.
type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;

export interface TenantsTable {
  id: Generated<string>;
  slug: string;
  name: string;
  error_budget_fraction: Generated<number>;
  created_at: Generated<Timestamp>;
}

export interface Database {
  tenants: TenantsTable;
}
