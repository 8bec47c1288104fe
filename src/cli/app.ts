// Building and serving the Next.js app for `npm start` and `npm test`.
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { migrateToLatest } from "../server/db/migrate";
import { log, runningRecorded, SetupError, startDetached, stopRecorded, waitForPort } from "./processes";
import { projectRoot, type Profile } from "./profile";

const BUILD_INPUTS = ["src", "public", "next.config.ts", "tailwind.config.ts", "postcss.config.mjs", "tsconfig.json", "package-lock.json"];
const nextBin = path.join(projectRoot, "node_modules/next/dist/bin/next");

function hashInputs(): string {
  const hash = createHash("sha256");
  const visit = (relative: string) => {
    const full = path.join(projectRoot, relative);
    if (!existsSync(full)) return;
    if (statSync(full).isDirectory()) {
      for (const entry of readdirSync(full).sort()) visit(path.join(relative, entry));
      return;
    }
    if (/\.test\.ts$/.test(relative)) return; // tests do not change the build
    hash.update(relative).update("\0").update(readFileSync(full)).update("\0");
  };
  BUILD_INPUTS.forEach(visit);
  return hash.digest("hex");
}

export async function migrate(env: Record<string, string>): Promise<void> {
  const applied = await migrateToLatest(env.MIGRATION_DATABASE_URL!, path.join(projectRoot, "migrations"));
  log(applied.length ? `applied ${applied.length} migration(s)` : "database schema is up to date");
}

/** Builds the app when its sources changed since the last build; returns true when it built. */
export function buildIfNeeded(env: Record<string, string>): boolean {
  const stamp = path.join(projectRoot, ".next", "lotwarden-build-hash");
  const hash = hashInputs();
  if (existsSync(stamp) && readFileSync(stamp, "utf8") === hash && existsSync(path.join(projectRoot, ".next", "BUILD_ID"))) {
    log("app build is up to date");
    return false;
  }
  log("building the app (next build)…");
  const started = Date.now();
  const result = spawnSync(process.execPath, [nextBin, "build"], {
    cwd: projectRoot,
    stdio: "inherit",
    env: { ...process.env, ...env, NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1" },
  });
  if (result.status !== 0) throw new SetupError("next build failed; see the messages above");
  writeFileSync(stamp, hash);
  log(`built in ${((Date.now() - started) / 1000).toFixed(0)} s`);
  return true;
}

/**
 * V8 flags for the app process. A young generation of up to 32 MB a semi-space (Node's default is 16 MB): an ingest
 * allocates short-lived rows and die records fast, and with the default a part of them lived through two scavenges,
 * was promoted and piled up as garbage in the old generation until a full collection: in 6 of 10 runs of
 * bench:ingest the app's RSS climbed from about 240 to 490–550 MB during the job while the heap left after each full
 * collection stayed near 70 MB (Node.js documentation, "--max-semi-space-size"). Since the CSV is parsed in a worker
 * thread (src/server/jobs/read-in-thread.ts, its own heap), this thread makes less of that garbage: over six jobs of
 * bench:ingest, peak RSS was 401 and 485 MB (1× and 4× lots) with 64 MB semi-spaces, 355–359 and 416–437 MB with
 * 32 MB in two runs, and the jobs were no slower.
 */
export const APP_NODE_FLAGS = ["--max-semi-space-size=32"];

export async function serveApp(profile: Profile, env: Record<string, string>, restart: boolean): Promise<void> {
  if (runningRecorded(profile.dataDir, "app")) {
    if (!restart) {
      log(`app already running on ${env.APP_URL}`);
      return;
    }
    await stopRecorded(profile.dataDir, "app");
  }
  const started = startDetached(
    profile.dataDir,
    "app",
    process.execPath,
    [...APP_NODE_FLAGS, nextBin, "start", "-H", "127.0.0.1", "-p", String(profile.appPort)],
    { ...process.env, ...env, NEXT_TELEMETRY_DISABLED: "1" },
    projectRoot,
  );
  await waitForPort(profile.appPort, "the app", 60_000, started.pid);
  const deadline = Date.now() + 30_000;
  for (;;) {
    try {
      const health = await fetch(`${env.APP_URL}/api/health`);
      const body = (await health.json()) as { status: string; services: Record<string, { status: string; reason?: string }> };
      if (body.status === "ok") break;
      if (Date.now() > deadline) throw new SetupError(`the app answers but is not healthy: ${JSON.stringify(body.services)}`);
    } catch (error) {
      if (error instanceof SetupError) throw error;
      if (Date.now() > deadline) throw new SetupError(`the app does not answer /api/health: ${String(error)}`);
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  log(`app is up on ${env.APP_URL} (log: ${started.logFile})`);
}

export async function startWorker(profile: Profile, env: Record<string, string>, tasks: string): Promise<void> {
  await stopRecorded(profile.dataDir, "worker");
  startDetached(profile.dataDir, "worker", process.execPath, ["--import", "tsx", path.join(projectRoot, "src/cli/worker.ts")], { ...process.env, ...env, WORKER_TASKS: tasks }, projectRoot);
  log(`worker started (${tasks})`);
}
