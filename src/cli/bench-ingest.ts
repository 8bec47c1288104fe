// `npm run bench:ingest`: the ingest benchmark. Starts its own services (the test profile on the bench's own ports
// and data), then for a 25 × 5,000 × 11 lot and one with 4× the dies measures csv-parse alone over the file, the
// end-to-end ingest through the API and the worker, and the app process's peak RSS, in three alternating tries of
// each (best time of each, highest RSS). Prints figures, asserts none.
// `--size-gb 2` instead ingests one ≥ 2 GB file, printing RSS over time, to show the pipeline streams.
// Other options: `--grow points` (4× the points a die instead of 4× the dies), `--timeline <s>` (RSS every s seconds),
// `--tmp-dir <dir>` (where the files go, default the OS temp folder), `--keep-files`.
//
// It drives the pipeline over HTTP rather than in-process: the job runs inside the Next.js app (the worker calls
// the internal route), so only the real app shows the memory and the time of what production runs, upload included.
import { existsSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { buildIfNeeded, migrate, serveApp, startWorker } from "./app";
import { estimateRowBytes, type LotShape, type WrittenLot, writeLotFile } from "./bench/ingest-lot-file";
import { createBenchTenant } from "./bench/ingest-client";
import { type IngestRun, mb, measureIngest, type ServicePids } from "./bench/ingest-measure";
import { parseAlone, type ParseRun } from "./bench/ingest-parse-alone";
import { type BenchRow, formatReport, isComplete } from "./bench/ingest-report";
import { findPostmaster } from "./bench/proc-stats";
import { RssSampler } from "./bench/rss-sampler";
import { removeCluster } from "./postgres";
import { log, readPid, SetupError } from "./processes";
import { profile, projectRoot } from "./profile";
import { startServices, stopServices } from "./services";

const PRODUCT = "BENCH-NW40";
const MAX_WAFERS = 25; // §3: slots 1–25
const BASE: Omit<LotShape, "lot"> = { product: PRODUCT, wafers: MAX_WAFERS, diesPerWafer: 5_000, pointsPerDie: 11 };

function option(name: string): string | undefined {
  const at = process.argv.indexOf(`--${name}`);
  return at === -1 ? undefined : process.argv[at + 1];
}

// Own ports and data unless told otherwise, so a benchmark never meets `npm start` (3000, 5432x–5433x) or `npm test` (3100, 5433x–5434x).
const defaults: Record<string, string> = {
  LOTWARDEN_DATA_DIR: path.join(projectRoot, ".data", "bench"),
  LOTWARDEN_TEST_PG_PORT: "55439", LOTWARDEN_TEST_S3_PORT: "55441", LOTWARDEN_TEST_SMTP_PORT: "55435",
  LOTWARDEN_TEST_MAIL_API_PORT: "55436", LOTWARDEN_TEST_APP_PORT: "3300",
};
for (const [key, value] of Object.entries(defaults)) process.env[key] ??= value;
const bench = profile("test");
const sizeGb = option("size-gb") === undefined ? null : Number(option("size-gb"));
const grow = option("grow") ?? "dies";
const tmpDir = option("tmp-dir") ?? os.tmpdir();
const keepFiles = process.argv.includes("--keep-files");
const timelineSeconds = option("timeline") === undefined ? null : Number(option("timeline"));
const written: string[] = [];

/** The shapes to run: the lot and 4× it, or one lot of at least `sizeGb` GB (more dies, same sweep). */
function shapes(): { name: string; shape: LotShape }[] {
  if (sizeGb !== null) {
    if (!(sizeGb > 0)) throw new SetupError("--size-gb needs a positive number of GB");
    const rows = (sizeGb * 1e9) / estimateRowBytes(BASE);
    const diesPerWafer = Math.ceil((1.03 * rows) / (MAX_WAFERS * BASE.pointsPerDie));
    return [{ name: `${sizeGb} GB`, shape: { ...BASE, diesPerWafer, lot: `BENCH-${sizeGb}GB` } }];
  }
  if (grow !== "dies" && grow !== "points") throw new SetupError("--grow is dies (20,000 dies a wafer) or points (44 a die)");
  const larger = grow === "dies" ? { diesPerWafer: 4 * BASE.diesPerWafer } : { pointsPerDie: 4 * BASE.pointsPerDie };
  return [
    { name: "1× (25×5000×11)", shape: { ...BASE, lot: "BENCH-1X" } },
    { name: grow === "dies" ? "4× (25×20000×11)" : "4× (25×5000×44)", shape: { ...BASE, ...larger, lot: "BENCH-4X" } },
  ];
}

async function main(): Promise<void> {
  if (path.resolve(bench.dataDir) === path.join(projectRoot, ".data", "test")) throw new SetupError("the benchmark would share npm test's data folder: set LOTWARDEN_DATA_DIR elsewhere");
  const runs = shapes();
  await stopServices(bench); // whatever an interrupted run left behind
  if (!process.env.DATABASE_URL) removeCluster(bench);
  rmSync(bench.dataDir, { recursive: true, force: true });
  const env = await startServices(bench);
  await migrate(env);
  buildIfNeeded(env);
  await serveApp(bench, env, true);
  await startWorker(bench, env, "ingest");
  const appPid = readPid(bench.dataDir, "app");
  if (appPid === null) throw new SetupError("the app's PID file is missing");
  const sampler = new RssSampler(appPid, 100).start();
  const pids: ServicePids = { app: appPid, postgres: process.env.DATABASE_URL ? null : findPostmaster(bench.pgPort), objectStore: readPid(bench.dataDir, "s3-fake") };
  const tenant = await createBenchTenant(env.MIGRATION_DATABASE_URL!, env.APP_URL!, PRODUCT);

  // A small lot first, so route compilation and the first connections are not billed to the measured runs.
  const warmPath = path.join(tmpDir, `lotwarden-bench-${process.pid}-warm-up.csv`);
  written.push(warmPath);
  await writeLotFile(warmPath, { ...BASE, wafers: 2, diesPerWafer: 500, lot: "BENCH-WARM" });
  await measureIngest(tenant, warmPath, sampler, pids, 120_000);
  log(`warmed up; app RSS ${mb(sampler.now().treeBytes).toFixed(0)} MB`);

  const rows: BenchRow[] = [];
  for (const { name, shape } of runs) {
    const big = sizeGb !== null;
    // Three tries of a lot (one for a big file), csv-parse alone and the ingest taking turns on the same file, and
    // the best of each compared: on a shared machine the floor is the steadiest estimate of either, and taking
    // turns gives both the same spells of contention. Each try is its own lot (the same bytes would answer the
    // first job); peak RSS is the highest of all tries.
    const parses: ParseRun[] = [];
    const ingests: IngestRun[] = [];
    let lot: WrittenLot | null = null;
    for (let i = 0; i < (big ? 1 : 3); i++) {
      const tryShape = big ? shape : { ...shape, lot: `${shape.lot}-${i + 1}` };
      const file = path.join(tmpDir, `lotwarden-bench-${process.pid}-${tryShape.lot}.csv`);
      written.push(file);
      const startedWrite = Date.now();
      lot = await writeLotFile(file, tryShape);
      log(`${name}: wrote ${lot.rows.toLocaleString("en")} rows, ${mb(lot.bytes).toFixed(0)} MB in ${((Date.now() - startedWrite) / 1000).toFixed(1)} s to ${file}`);
      parses.push(await parseAlone(file, lot.firstDataLine));
      if (big) log(`${name}: csv-parse alone ${parses[0]!.seconds.toFixed(2)} s; ingesting; RSS of the app process every 10 s`);
      const ingest = await measureIngest(tenant, file, sampler, pids, big ? 40 * 60_000 : 15 * 60_000, timelineSeconds ?? (big ? 10 : 0));
      ingests.push(ingest);
      log(`${name}, try ${i + 1}: csv-parse alone ${parses.at(-1)!.seconds.toFixed(2)} s; ingested in ${ingest.totalSeconds.toFixed(2)} s (job ${ingest.jobSeconds.toFixed(2)} s)`);
      if (!isComplete({ name, file: lot, parse: parses.at(-1)!, ingest })) throw new SetupError(`${name}, try ${i + 1}: the job did not ingest the whole file`);
      if (!keepFiles) rmSync(file, { force: true });
    }
    const parse = parses.reduce((best, p) => (p.seconds < best.seconds ? p : best));
    const fastest = ingests.reduce((best, r) => (r.totalSeconds < best.totalSeconds ? r : best));
    const highest = (pick: (r: IngestRun) => number) => Math.max(...ingests.map(pick));
    const ingest: IngestRun = {
      ...fastest,
      peakUploadRssBytes: highest((r) => r.peakUploadRssBytes), peakJobRssBytes: highest((r) => r.peakJobRssBytes),
      peakJudgeRssBytes: highest((r) => r.peakJudgeRssBytes), peakOwnRssBytes: highest((r) => r.peakOwnRssBytes),
    };
    rows.push({ name, file: lot!, parse, ingest, tries: parses.map((p, i) => ({ parseSeconds: p.seconds, totalSeconds: ingests[i]!.totalSeconds })) });
  }
  sampler.stop();
  process.stdout.write(`\n${formatReport(rows)}`);
  process.stdout.write(`RSS: VmRSS of the app process (PID ${appPid}) and its children, sampled every 100 ms; sizes in MiB.\n`);
  if (!rows.every(isComplete)) throw new SetupError("a job did not ingest the whole file (see INCOMPLETE above)");
}

let exitCode = 0;
process.once("SIGINT", () => {
  void stopServices(bench).finally(() => process.exit(130));
});
try {
  await main();
} catch (error) {
  process.stderr.write(`bench: ${error instanceof SetupError ? error.message : String((error as Error)?.stack ?? error)}\n`);
  exitCode = 1;
} finally {
  if (!keepFiles) for (const file of written) if (existsSync(file)) rmSync(file, { force: true });
  await stopServices(bench).catch(() => undefined);
}
process.exit(exitCode);
