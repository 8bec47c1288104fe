// Runs the migrations in migrations/ with Kysely's Migrator. Used by `npm run db:migrate`, `npm start` and
// `npm test`; it connects as the schema owner (MIGRATION_DATABASE_URL), never as the app role.
import { promises as fs } from "node:fs";
import path from "node:path";
import { FileMigrationProvider, Kysely, Migrator, PostgresDialect } from "kysely";
import pg from "pg";

export async function migrateToLatest(connectionString: string, migrationFolder: string): Promise<string[]> {
  const db = new Kysely<unknown>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString, max: 2 }) }) });
  try {
    const migrator = new Migrator({ db, provider: new FileMigrationProvider({ fs, path, migrationFolder }) });
    const { error, results } = await migrator.migrateToLatest();
    const failed = results?.find((r) => r.status === "Error");
    if (error || failed) {
      const name = failed ? ` (${failed.migrationName})` : "";
      throw new Error(`migration failed${name}: ${error instanceof Error ? error.message : String(error)}`);
    }
    return (results ?? []).map((r) => r.migrationName);
  } finally {
    await db.destroy();
  }
}
