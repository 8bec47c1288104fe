// The project-local PostgreSQL cluster, from Debian's postgresql package. initdb and the server refuse to run as
// root, so as root both run as the `postgres` system user the package creates.
import { execFileSync, spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { chmodSync, chownSync, existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { log, portInUse, SetupError } from "./processes";
import type { Profile } from "./profile";

export interface DatabaseUrls {
  /** The owner of the schema: runs migrations. */
  ownerUrl: string;
  /** The role the app connects as: owns no table, is no superuser, so row-level security applies to it. */
  appUrl: string;
}

const OWNER = "lotwarden_owner";
const APP_ROLE = "lotwarden_app";
const DATABASE = "lotwarden";

function postgresBin(): string {
  const base = "/usr/lib/postgresql";
  const versions = existsSync(base) ? readdirSync(base).filter((v) => existsSync(path.join(base, v, "bin", "initdb"))) : [];
  versions.sort((a, b) => Number(b) - Number(a));
  if (!versions[0]) throw new SetupError("PostgreSQL is not installed: apt-get install -y postgresql");
  return path.join(base, versions[0], "bin");
}

const asRoot = typeof process.getuid === "function" && process.getuid() === 0;

function systemUser(): { uid: number; gid: number } | null {
  if (!asRoot) return null;
  try {
    const uid = Number(execFileSync("id", ["-u", "postgres"]).toString().trim());
    const gid = Number(execFileSync("id", ["-g", "postgres"]).toString().trim());
    return { uid, gid };
  } catch {
    throw new SetupError("running as root, but there is no `postgres` system user to run PostgreSQL as (install the postgresql package)");
  }
}

function runPg(tool: string, args: string[]): { status: number; output: string } {
  const bin = path.join(postgresBin(), tool);
  const [cmd, cmdArgs] = asRoot ? ["runuser", ["-u", "postgres", "--", bin, ...args]] : [bin, args];
  const result = spawnSync(cmd, cmdArgs, { encoding: "utf8" });
  return { status: result.status ?? 1, output: `${result.stdout ?? ""}${result.stderr ?? ""}` };
}

/** Each parent folder must be traversable by the postgres user; otherwise keep the cluster in a short /var/tmp path. */
function clusterDir(profile: Profile): string {
  const preferred = path.join(profile.dataDir, "pg");
  if (!asRoot) return preferred;
  let dir = path.dirname(preferred);
  let traversable = true;
  while (dir !== path.dirname(dir)) {
    if (existsSync(dir) && (statSync(dir).mode & 0o001) === 0) traversable = false;
    dir = path.dirname(dir);
  }
  if (traversable && preferred.length < 90) return preferred;
  const hash = Buffer.from(preferred).toString("base64url").slice(-12);
  return path.join("/var/tmp", `lotwarden-${profile.name}-${hash}`);
}

function secretsFile(profile: Profile): string {
  return path.join(profile.dataDir, "pg-secrets.json");
}

function readSecrets(profile: Profile): { owner: string; app: string } {
  const file = secretsFile(profile);
  if (existsSync(file)) return JSON.parse(readFileSync(file, "utf8"));
  const secrets = { owner: randomBytes(18).toString("base64url"), app: randomBytes(18).toString("base64url") };
  mkdirSync(profile.dataDir, { recursive: true });
  writeFileSync(file, JSON.stringify(secrets), { mode: 0o600 });
  return secrets;
}

function initCluster(profile: Profile, dir: string, ownerPassword: string): void {
  log(`creating the PostgreSQL cluster in ${dir}`);
  mkdirSync(dir, { recursive: true });
  const user = systemUser();
  if (user) chownSync(dir, user.uid, user.gid);
  chmodSync(dir, 0o700);
  const pwfile = path.join(os.tmpdir(), `lotwarden-pw-${process.pid}`);
  writeFileSync(pwfile, ownerPassword, { mode: 0o644 });
  const args = ["-D", dir, `--username=${OWNER}`, `--pwfile=${pwfile}`, "--auth-host=scram-sha-256", "--auth-local=peer", "--encoding=UTF8", "--locale=C.UTF-8"];
  if (profile.fastPostgres) args.push("--no-sync");
  const result = runPg("initdb", args);
  rmSync(pwfile, { force: true });
  if (result.status !== 0) throw new SetupError(`initdb failed:\n${result.output}`);
}

function isRunning(dir: string): boolean {
  return runPg("pg_ctl", ["-D", dir, "status"]).status === 0;
}

export async function startPostgres(profile: Profile): Promise<DatabaseUrls> {
  const dir = clusterDir(profile);
  const secrets = readSecrets(profile);
  if (!existsSync(path.join(dir, "PG_VERSION"))) {
    if (existsSync(dir)) rmSync(dir, { recursive: true, force: true }); // a half-made cluster from an interrupted initdb
    initCluster(profile, dir, secrets.owner);
  }
  if (!isRunning(dir)) {
    if (await portInUse(profile.pgPort)) {
      throw new SetupError(
        `port ${profile.pgPort} is taken by another program, not this project's PostgreSQL. ` +
          `Stop it, or choose another port with LOTWARDEN_${profile.name === "test" ? "TEST_" : ""}PG_PORT, or point DATABASE_URL at your own server.`,
      );
    }
    // A cluster left by a crash keeps a postmaster.pid whose process is gone: the server detects that itself.
    const settings = [`-p ${profile.pgPort}`, "-c listen_addresses=127.0.0.1", "-c unix_socket_directories=''"];
    if (profile.fastPostgres) settings.push("-c fsync=off", "-c synchronous_commit=off", "-c full_page_writes=off");
    const logFile = path.join(dir, "server.log");
    const result = runPg("pg_ctl", ["-D", dir, "-l", logFile, "-o", settings.join(" "), "-w", "-t", "60", "start"]);
    if (result.status !== 0) {
      const tail = existsSync(logFile) ? readFileSync(logFile, "utf8").split("\n").slice(-15).join("\n") : "";
      throw new SetupError(`PostgreSQL did not start:\n${result.output}\n${tail}`);
    }
    log(`PostgreSQL is up on 127.0.0.1:${profile.pgPort}`);
  } else {
    log(`PostgreSQL already running on 127.0.0.1:${profile.pgPort}`);
  }
  await provision(profile, secrets);
  const base = `127.0.0.1:${profile.pgPort}/${DATABASE}`;
  return {
    ownerUrl: `postgres://${OWNER}:${encodeURIComponent(secrets.owner)}@${base}`,
    appUrl: `postgres://${APP_ROLE}:${encodeURIComponent(secrets.app)}@${base}`,
  };
}

async function provision(profile: Profile, secrets: { owner: string; app: string }): Promise<void> {
  const admin = new pg.Client({ host: "127.0.0.1", port: profile.pgPort, user: OWNER, password: secrets.owner, database: "postgres" });
  await admin.connect();
  try {
    const role = await admin.query("select 1 from pg_roles where rolname = $1", [APP_ROLE]);
    if (role.rowCount === 0) {
      await admin.query(`create role ${APP_ROLE} login nosuperuser nocreatedb nocreaterole nobypassrls password '${secrets.app.replace(/'/g, "''")}'`);
    }
    const db = await admin.query("select 1 from pg_database where datname = $1", [DATABASE]);
    if (db.rowCount === 0) await admin.query(`create database ${DATABASE} owner ${OWNER}`);
  } finally {
    await admin.end();
  }
  const owner = new pg.Client({ host: "127.0.0.1", port: profile.pgPort, user: OWNER, password: secrets.owner, database: DATABASE });
  await owner.connect();
  try {
    // Tables made by migrations are usable by the app role, which still owns none of them.
    await owner.query(`grant usage on schema public to ${APP_ROLE}`);
    await owner.query(`alter default privileges for role ${OWNER} in schema public grant select, insert, update, delete on tables to ${APP_ROLE}`);
    await owner.query(`alter default privileges for role ${OWNER} in schema public grant usage, select on sequences to ${APP_ROLE}`);
    await owner.query(`grant select, insert, update, delete on all tables in schema public to ${APP_ROLE}`);
    await owner.query(`grant usage, select on all sequences in schema public to ${APP_ROLE}`);
  } finally {
    await owner.end();
  }
}

export function stopPostgres(profile: Profile): boolean {
  const dir = clusterDir(profile);
  if (!existsSync(path.join(dir, "PG_VERSION")) || !isRunning(dir)) return false;
  const result = runPg("pg_ctl", ["-D", dir, "-m", "fast", "-w", "stop"]);
  if (result.status !== 0) throw new SetupError(`PostgreSQL did not stop:\n${result.output}`);
  return true;
}

export function removeCluster(profile: Profile): void {
  const dir = clusterDir(profile);
  stopPostgres(profile);
  rmSync(dir, { recursive: true, force: true });
}
