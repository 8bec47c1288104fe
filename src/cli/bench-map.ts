// `npm run bench:map`: issue 7's wafer-map and die-API performance figures. Starts the test-profile services and
// app afresh (like `npm test`, so not while `npm test` runs on the same ports), loads 2,000-, 5,000- and
// 20,000-die wafers through the ingest API, measures the lot page in headless Chromium and the die API, prints
// the figures and ratios, and stops everything. Timings are printed, never asserted.
import { rmSync } from "node:fs";
import os from "node:os";
import { buildIfNeeded, migrate, serveApp, startWorker } from "./app";
import { measureLatency } from "./bench/map-api";
import { launchBench, measureInteractive, measurePaint, type InteractiveRun, type PaintRun } from "./bench/map-browser";
import { loadBenchFixture } from "./bench/map-fixture";
import { fixed, formatTable, median } from "./bench/map-stats";
import { removeCluster } from "./postgres";
import { log, SetupError } from "./processes";
import { profile } from "./profile";
import { startServices, stopServices } from "./services";
import { TEST_PASSWORD } from "../test/tenants";

const SMALL = 2_000;
const LARGE = 20_000;
const API_DIES = 5_000;
const REPEATS = 3;
const TARGET_INTERACTIVE_MS = 1_000; // issue 7
const TARGET_API_MEDIAN_MS = 200; // issue 7

type Run = { dies: number; paint: PaintRun; interactive: InteractiveRun };

const COLUMNS = ["dies", "run", "ready ms", "painted ms", "interactive ms", "data→paint ms", "data→tip ms", "tooltip ms", "dies fetch ms", "long tasks ms", "longest ms", "frame p50", "frame p95", "dropped", "dies hovered"];
const cells = (r: Run): number[] => [
  r.paint.readyMs, r.paint.paintedMs, r.interactive.interactiveMs, r.paint.dataToPaintMs, r.interactive.dataToInteractiveMs, r.interactive.tooltipLatencyMs, r.paint.diesFetchMs, r.paint.longTaskMs,
  r.paint.longestTaskMs, r.paint.hoverFrameP50Ms, r.paint.hoverFrameP95Ms, r.paint.hoverDroppedFrames, r.paint.diesHovered,
];
const DIGITS = [0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 0, 0];

function mapReport(runs: Run[]): string {
  const rows: string[][] = runs.map((r, i) => [String(r.dies), String(Math.floor(i / 2) + 1), ...cells(r).map((v, c) => fixed(v, DIGITS[c]))]);
  const medians = new Map<number, number[]>();
  for (const n of [SMALL, LARGE]) {
    const mine = runs.filter((r) => r.dies === n).map(cells);
    medians.set(n, DIGITS.map((_, c) => median(mine.map((m) => m[c]!))));
    rows.push([String(n), "median", ...medians.get(n)!.map((v, c) => fixed(v, DIGITS[c]))]);
  }
  const ratio = medians.get(LARGE)!.map((v, c) => v / medians.get(SMALL)![c]!);
  rows.push([`${LARGE / 1000}k/${SMALL / 1000}k`, "ratio", ...ratio.map((v) => (Number.isFinite(v) ? `${v.toFixed(2)}×` : "—"))]);
  const large = medians.get(LARGE)!;
  const verdict = (v: number) => (v < TARGET_INTERACTIVE_MS ? "met" : "MISSED");
  return [
    formatTable(COLUMNS, rows),
    "",
    `ready: data-die-count = N · painted: first frame after the map's last canvas draw · interactive: first die tooltip, hovering from "ready" on (all from navigation start)`,
    `data→paint, data→tip: from the last byte of the dies response to painted / to the first tooltip: the map's own render and time to interactive`,
    `frame p50/p95 and dropped: rAF intervals while moving over 50 neighbouring dies, one move a frame (idle frame ${fixed(median(runs.map((r) => r.paint.idleFrameMs)), 1)} ms)`,
    `target (${LARGE} dies render and become interactive < ${TARGET_INTERACTIVE_MS} ms once the data is in): painted ${fixed(large[3]!)} ms ${verdict(large[3]!)}, interactive ${fixed(large[4]!)} ms ${verdict(large[4]!)}`,
    `from navigation start (page, scripts, data and map): painted ${fixed(large[1]!)} ms, interactive ${fixed(large[2]!)} ms`,
  ].join("\n");
}

const test = profile("test");
let exitCode = 1;
try {
  log(`bench:map on ${os.cpus().length} CPU(s), load average ${os.loadavg().map((l) => l.toFixed(2)).join(" ")}`);
  await stopServices(test); // whatever an interrupted run left behind
  if (!process.env.DATABASE_URL) removeCluster(test);
  rmSync(test.dataDir, { recursive: true, force: true });
  const env = await startServices(test);
  await migrate(env);
  buildIfNeeded(env);
  await serveApp(test, env, true);
  await startWorker(test, env, "ingest");
  const appUrl = env.APP_URL!;

  log("loading the bench wafers through the ingest API…");
  const fixture = await loadBenchFixture(appUrl, env.MIGRATION_DATABASE_URL!, [SMALL, API_DIES, LARGE]);
  for (const lot of fixture.lots.values()) log(`  ${lot.lot}: ${lot.dieCount} dies of ${lot.dieSideMm} mm on 200 mm, ingested in ${fixed(lot.ingestMs)} ms`);
  const email = fixture.tenant.users.analyst!.email;

  const browser = await launchBench();
  const runs: Run[] = [];
  try {
    for (const n of [SMALL, LARGE]) await measurePaint(browser, appUrl, email, TEST_PASSWORD, fixture.lots.get(n)!); // warm-up, not counted
    for (let i = 0; i < REPEATS; i++) {
      for (const n of [SMALL, LARGE]) {
        const lot = fixture.lots.get(n)!;
        log(`  map run ${i + 1}/${REPEATS}, ${n} dies`);
        runs.push({ dies: n, paint: await measurePaint(browser, appUrl, email, TEST_PASSWORD, lot), interactive: await measureInteractive(browser, appUrl, email, TEST_PASSWORD, lot) });
      }
    }
  } finally {
    await browser.close();
  }

  const apiLot = fixture.lots.get(API_DIES)!;
  const auth = { authorization: `Bearer ${fixture.tenant.keys.analyst}` };
  const dies = await measureLatency(`${appUrl}/api/v1/lots/${encodeURIComponent(apiLot.lot)}/dies?wafer=1`, auth);
  const health = await measureLatency(`${appUrl}/api/health`, {});

  process.stdout.write(`\nWafer map: /lots/<lot>?wafer=1 in headless Chromium, 1440×1400, a fresh context per load, ${REPEATS} runs each\n\n${mapReport(runs)}\n`);
  const apiRows = [
    [`GET /api/v1/lots/${apiLot.lot}/dies?wafer=1 (${API_DIES} dies)`, fixed(dies.medianMs, 1), fixed(dies.p95Ms, 1), fixed(dies.minMs, 1), fixed(dies.maxMs, 1), String(dies.bodyBytes)],
    ["GET /api/health", fixed(health.medianMs, 1), fixed(health.p95Ms, 1), fixed(health.minMs, 1), fixed(health.maxMs, 1), String(health.bodyBytes)],
  ];
  process.stdout.write(`\nDie API: ${dies.requests} warm sequential requests each after 5 unmeasured\n\n${formatTable(["request", "median ms", "p95 ms", "min ms", "max ms", "bytes"], apiRows)}\n`);
  process.stdout.write(`dies/health median ratio ${(dies.medianMs / health.medianMs).toFixed(1)}× · target median < ${TARGET_API_MEDIAN_MS} ms: ${dies.medianMs < TARGET_API_MEDIAN_MS ? "met" : "MISSED"}\n`);
  log(`load average at the end ${os.loadavg().map((l) => l.toFixed(2)).join(" ")}`);
  exitCode = 0;
} catch (error) {
  process.stderr.write(`lotwarden: ${error instanceof SetupError ? error.message : String((error as Error)?.stack ?? error)}\n`);
} finally {
  await stopServices(test).catch(() => undefined);
}
process.exit(exitCode);
