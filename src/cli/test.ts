// `npm test`: fresh test services on their own ports and data, a build, the app on 127.0.0.1:3100, then every
// suite (unit, integration, browser) in one Vitest run. Exits non-zero on any failure.
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";
import { buildIfNeeded, migrate, serveApp, startWorker } from "./app";
import { log, SetupError } from "./processes";
import { profile, projectRoot } from "./profile";
import { startServices, stopServices } from "./services";
import { removeCluster } from "./postgres";

const test = profile("test");
const started = Date.now();
let exitCode = 1;
try {
  await stopServices(test); // whatever an interrupted run left behind
  if (!process.env.DATABASE_URL) removeCluster(test);
  rmSync(test.dataDir, { recursive: true, force: true });
  log("type-checking the project (tsc --noEmit)…");
  const typecheck = spawnSync(process.execPath, [path.join(projectRoot, "node_modules/typescript/bin/tsc"), "--noEmit", "-p", projectRoot], { cwd: projectRoot, stdio: "inherit" });
  if (typecheck.status !== 0) throw new SetupError("the project does not type-check; see the errors above");
  const env = await startServices(test);
  await migrate(env);
  buildIfNeeded(env);
  // Ingest jobs hand PostgreSQL their dies in segments of 256 KiB and up, not 4 MiB: the test files then cross
  // segment boundaries (dies split across segments, wafers replaced segment by segment).
  await serveApp(test, { ...env, INGEST_SEGMENT_BYTES: String(256 * 1024) }, true);
  await startWorker(test, env, "ingest,mail");

  const results = path.join(test.dataDir, "vitest-results.json");
  const args = [path.join(projectRoot, "node_modules/vitest/vitest.mjs"), "run", "--reporter=default", "--reporter=json", `--outputFile.json=${results}`, ...process.argv.slice(2)];
  const run = spawnSync(process.execPath, args, {
    cwd: projectRoot,
    stdio: "inherit",
    env: { ...process.env, ...env, NODE_ENV: "test", LOTWARDEN_TEST_APP_URL: env.APP_URL, CHROMIUM_PATH: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium" },
  });
  exitCode = run.status ?? 1;
  if (existsSync(results)) {
    const summary = JSON.parse(readFileSync(results, "utf8")) as { numPassedTests: number; numFailedTests: number; numPendingTests: number };
    log(`finished in ${((Date.now() - started) / 1000).toFixed(0)} s`);
    process.stdout.write(`${summary.numPassedTests} passed, ${summary.numFailedTests} failed, ${summary.numPendingTests} skipped\n`);
  }
} catch (error) {
  process.stderr.write(`lotwarden: ${error instanceof SetupError ? error.message : String((error as Error)?.stack ?? error)}\n`);
  exitCode = 1;
} finally {
  await stopServices(test).catch(() => undefined);
}
process.exit(exitCode);
