import "server-only";
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import { env } from "../env";
import type { Database } from "./schema";

// One pool per process, kept on globalThis so development hot reloads reuse it.
const globalForDb = globalThis as unknown as { lotwardenDb?: Kysely<Database>; lotwardenPool?: pg.Pool };

function create(): Kysely<Database> {
  const pool = new pg.Pool({ connectionString: env.DATABASE_URL, max: 10 });
  globalForDb.lotwardenPool = pool;
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
}

export const db: Kysely<Database> = globalForDb.lotwardenDb ?? create();
globalForDb.lotwardenDb = db;
/** The same pool, for the session library's adapter (global tables only). */
export const pool: pg.Pool = globalForDb.lotwardenPool!;
