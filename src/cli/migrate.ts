// `npm run db:migrate`: migrates the database named by MIGRATION_DATABASE_URL (or DATABASE_URL), or else the one
// the last `npm start` set up.
import path from "node:path";
import { migrateToLatest } from "../server/db/migrate";
import { log } from "./processes";
import { profile, projectRoot } from "./profile";
import { savedEnv } from "./services";

const url = process.env.MIGRATION_DATABASE_URL ?? process.env.DATABASE_URL ?? savedEnv(profile("dev"))?.MIGRATION_DATABASE_URL;
if (!url) {
  process.stderr.write("lotwarden: no database to migrate: run `npm start` first, or set MIGRATION_DATABASE_URL\n");
  process.exit(1);
}
const applied = await migrateToLatest(url, path.join(projectRoot, "migrations"));
log(applied.length ? `applied ${applied.length} migration(s): ${applied.join(", ")}` : "database schema is up to date");
