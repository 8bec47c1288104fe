import "server-only";
import { pipeline } from "node:stream/promises";
import { Readable } from "node:stream";
import type pg from "pg";
import { from as copyFrom } from "pg-copy-streams";
import { ProbeFileError, type ProbeFileSummary, unpackFragments } from "@/domain/probe-file";
import { analyzeDieArrays, type ExtractionSettings } from "@/domain/transport";
import type { IngestReport } from "@/lib/schemas/ingest";
import { pool } from "../db/client";
import { env } from "../env";
import { getProduct } from "../db/queries/products";
import { systemScope, withScope } from "../db/scope";
import { AppError } from "../http/errors";
import { openRawFile } from "../storage/raw-files";
import { judgeAfterIngest } from "../spc/judge-after-ingest";
import { staticWindowInForce } from "../spc/static-window";
import { COPY_HEADER, COPY_TMP_DIES, COPY_TRAILER, CREATE_TMP_DIES, DieCopyEncoder, INDEX_TMP_DIES } from "./die-copy";
import { finishWafers, placeDies, placeSegment, refreshLotTotals, type WaferPlacement } from "./lot-aggregates";
import { type ClaimedJob, failJob, heartbeat, retryJob } from "./queue";
import { readProbeFileBatchesInThread } from "./read-in-thread";
import { SegmentedCopy } from "./segmented-copy";
import { concatSweeps, decodeSweep } from "./sweep-codec";

const RESERVED_METADATA = new Set(["lot", "product", "chuck_temperature_k"]);
// COPY rows go to PostgreSQL in batches of about this many bytes: a write per die (~400 bytes) cost a CopyData
// message and a trip through the stream machinery each, about a third of the stream stage as measured by bench:ingest.
const COPY_BATCH_BYTES = 64 * 1024;
// Segments (see streamDies) of a tenth of what went before, between these bounds: the last one, which PostgreSQL
// moves after the file has been read, is then at most a tenth of the whole, and even a file of several GB has
// under a hundred. The first bound is INGEST_SEGMENT_BYTES (4 MiB; the tests set 256 KiB so that their files cross
// segments).
const MIN_SEGMENT_BYTES = env.INGEST_SEGMENT_BYTES;
const MAX_SEGMENT_BYTES = 64 * 2 ** 20;
// COPY bytes that may wait for PostgreSQL while it moves a segment; beyond it the job waits.
const MAX_QUEUED_BYTES = 16 * 2 ** 20;

interface Context {
  job: ClaimedJob;
  settings: ExtractionSettings;
  chuckTemperatureK: number;
}

interface Lease {
  lost: () => boolean;
  stop: () => void;
}

/**
 * Renews the job's lease every 5 s for as long as the job runs, the set-based steps after the stream included
 * (on a large lot they outlast LEASE_SECONDS); `lost` turns true once another worker has taken the job over.
 */
function keepLease(job: ClaimedJob, progress: () => number): Lease {
  let lost = false;
  let renewing = false;
  const timer = setInterval(() => {
    if (renewing || lost) return;
    renewing = true;
    heartbeat(job, progress())
      .then((held) => (lost ||= !held), () => undefined) // a failed renewal is retried on the next tick
      .finally(() => (renewing = false));
  }, 5000);
  return { lost: () => lost, stop: () => clearInterval(timer) };
}

/** Wall time per stage of a job and the app's resident memory at the end, for the app log: "4.71 s (stream 3.10, merge 0.02, …), RSS 236 MB". */
function stageClock() {
  const started = performance.now();
  let last = started;
  const laps: string[] = [];
  return {
    lap(name: string) {
      const now = performance.now();
      laps.push(`${name} ${((now - last) / 1000).toFixed(2)}`);
      last = now;
    },
    summary: () => `${((performance.now() - started) / 1000).toFixed(2)} s (${laps.join(", ")}), RSS ${(process.memoryUsage.rss() / 2 ** 20).toFixed(0)} MB`,
  };
}

/** One COPY per segment into tmp_dies, each placed (placeSegment) while the next is being written. */
function segmentWriter(client: pg.PoolClient, placement: WaferPlacement): SegmentedCopy {
  return new SegmentedCopy(client, {
    copySql: COPY_TMP_DIES, header: COPY_HEADER, trailer: COPY_TRAILER, maxQueuedBytes: MAX_QUEUED_BYTES,
    flush: (after, upTo) => placeSegment(client, placement, after, upTo),
    segmentBytes: (sent) => Math.min(MAX_SEGMENT_BYTES, Math.max(MIN_SEGMENT_BYTES, sent / 10)),
  });
}

/**
 * Streams the raw file through the probe-file reader and the §5 computation into the lot's dies. The reader runs
 * in its own thread: parsing was the larger half of this stage's CPU, and this thread fits and encodes the dies of
 * one chunk while the reader parses the next. The dies go to PostgreSQL in segments (segmentWriter): PostgreSQL
 * moves one segment into dies while this thread encodes the next, rather than moving all of them after the file
 * (that took a third of a job's time). `onHeader` gets the file's header before any die is written and returns
 * where the dies go.
 */
async function streamDies(
  client: pg.PoolClient, ctx: Context, lease: Lease, objectKey: string, onProgress: (bytesRead: number) => void,
  onHeader: (header: { metadata: Record<string, string> }) => Promise<WaferPlacement>,
) {
  let header: { metadata: Record<string, string>; ignoredColumns: string[] } | null = null;
  let summary: ProbeFileSummary | null = null;
  let placement: WaferPlacement | null = null;
  let writer: SegmentedCopy | null = null;
  const reader = readProbeFileBatchesInThread(await openRawFile(objectKey), { errorBudgetFraction: await errorBudget(ctx.job.tenantId), onProgress });
  const encoder = new DieCopyEncoder();
  let lastLine = 0;
  try {
    for (;;) {
      const next = await reader.next();
      if (next.done) {
        summary = next.value;
        break;
      }
      const item = next.value;
      if (item.kind === "header") {
        header = item.header;
        placement = await onHeader(header);
        writer = segmentWriter(client, placement);
        continue;
      }
      for (const f of unpackFragments(item.batch)) {
        const temperatureK = f.temperatureK ?? ctx.chuckTemperatureK;
        const result = analyzeDieArrays(f.biasV, f.currentA, f.compliance, f.length, ctx.settings, temperatureK);
        // Segments are ranges of first lines (placeSegment): the reader gives dies in file order.
        if (f.firstLine <= lastLine) throw new Error(`the probe file reader gave a die of line ${f.firstLine} after one of line ${lastLine}`);
        lastLine = f.firstLine;
        encoder.die(f.wafer, f.x, f.y, result, f.site, f, f.firstLine);
      }
      if (encoder.size >= COPY_BATCH_BYTES) await writer!.write(encoder.take(), lastLine);
      if (lease.lost()) throw new Error("the job's lease was taken over by another worker");
    }
    if (!writer || !placement || !header) throw new Error("the probe file reader ended without a header");
    await writer.write(encoder.take(), lastLine);
    await writer.end();
  } catch (error) {
    // The COPY under way is cancelled, so that the connection can roll the transaction back.
    await writer?.abort(error instanceof Error ? error : new Error(String(error)));
    throw error;
  } finally {
    // When the COPY or the lease fails first, this stops the reader's thread and its download.
    await reader.return(undefined as never).catch(() => undefined);
  }
  return { summary, header, placement, segments: writer.segments };
}

interface RepeatedDies {
  wafers: number[];
  xs: number[];
  ys: number[];
}

/**
 * Dies that arrived as several fragments, found in tmp_dies after the stream rather than with a set of every die
 * seen: that set grew with the file (≈ 50 bytes a die, some 375 MB for a 2 GB file of 11-point sweeps).
 */
async function findRepeatedDies(client: pg.PoolClient): Promise<{ repeated: RepeatedDies; extraFragments: number }> {
  const { rows } = await client.query<{ wafer_slot: number; x: number; y: number; n: number }>(
    "select wafer_slot, x, y, count(*)::int as n from tmp_dies group by wafer_slot, x, y having count(*) > 1",
  );
  return {
    repeated: { wafers: rows.map((r) => r.wafer_slot), xs: rows.map((r) => r.x), ys: rows.map((r) => r.y) },
    extraFragments: rows.reduce((sum, r) => sum + r.n - 1, 0),
  };
}

async function errorBudget(tenantId: string): Promise<number> {
  return withScope(systemScope(tenantId, "ingest"), async (tx) => (await tx.selectFrom("tenants").select("error_budget_fraction").where("id", "=", tenantId).executeTakeFirstOrThrow()).error_budget_fraction);
}

/**
 * A die split over the file arrives as several rows of tmp_dies, the first of them in dies: join their points (in
 * file order), compute the die once and put it in place of its fragments. Set-based: one read of the fragments,
 * one delete from each table and one COPY of the merged dies, whatever their number (a delete and a COPY per die
 * took over a minute for a file with some 3,600 split dies).
 */
async function mergeRepeatedDies(client: pg.PoolClient, ctx: Context, placement: WaferPlacement, repeated: RepeatedDies): Promise<void> {
  if (repeated.wafers.length === 0) return;
  const keys = [repeated.wafers, repeated.xs, repeated.ys];
  const named = "(wafer_slot, x, y) in (select * from unnest($1::int[], $2::int[], $3::int[]))";
  const { rows } = await client.query(
    `select wafer_slot, x, y, temperature_k, site, sweep, first_line from tmp_dies where ${named} order by wafer_slot, x, y, first_line`,
    keys,
  );
  const groups = new Map<string, typeof rows>();
  for (const r of rows) {
    const key = `${r.wafer_slot} ${r.x} ${r.y}`;
    const parts = groups.get(key);
    if (parts) parts.push(r);
    else groups.set(key, [r]);
  }
  const encoder = new DieCopyEncoder();
  for (const parts of groups.values()) {
    const first = parts[0]!;
    const other = parts.find((p) => p.temperature_k !== first.temperature_k);
    if (other) throw new ProbeFileError("mixed_temperature", other.first_line, `die (${first.wafer_slot}, ${first.x}, ${first.y}) has points at ${first.temperature_k} K and at ${other.temperature_k} K`);
    const sweep = concatSweeps(parts.map((p) => decodeSweep(p.sweep)));
    const result = analyzeDieArrays(sweep.biasV, sweep.currentA, sweep.compliance, sweep.length, ctx.settings, first.temperature_k);
    encoder.die(first.wafer_slot, first.x, first.y, result, first.site, sweep, first.first_line);
  }
  await client.query(`delete from tmp_dies where ${named}`, keys);
  await client.query(`delete from dies where tenant_id = $4 and lot_id = $5 and ${named}`, [...keys, placement.tenantId, placement.lotId]);
  await pipeline(Readable.from([COPY_HEADER, encoder.take(), COPY_TRAILER]), client.query(copyFrom(COPY_TMP_DIES)));
  await placeDies(client, placement, repeated);
}

async function upsertLot(client: pg.PoolClient, ctx: Context, productId: string, customerId: string | null, productCode: string, metadata: Record<string, string>): Promise<{ id: string; probedAt: Date }> {
  const attributes = Object.fromEntries(Object.entries(metadata).filter(([k]) => !RESERVED_METADATA.has(k)));
  const measured = metadata.measured_at ? new Date(metadata.measured_at) : null;
  const probedAt = measured && !Number.isNaN(measured.getTime()) ? measured : new Date();
  const existing = await client.query("select id, status, product_id from lots where tenant_id = $1 and lot_number = $2 for update", [ctx.job.tenantId, ctx.job.lotNumber]);
  const lot = existing.rows[0];
  if (lot) {
    if (lot.product_id !== productId) throw new AppError("conflict", `Lot ${ctx.job.lotNumber} belongs to another product, not ${productCode}`);
    if (lot.status === "released" || lot.status === "scrapped") throw new AppError("conflict", `Lot ${ctx.job.lotNumber} is ${lot.status}: put it on hold before adding probe data`);
    await client.query(
      `update lots set attributes = attributes || $3::jsonb, station = coalesce($4, station), probed_at = greatest(probed_at, $5), chuck_temperature_k = $6,
              status = case when status = 'receiving' then 'probed' else status end, last_job_id = $7, updated_at = now()
        where tenant_id = $1 and id = $2`,
      [ctx.job.tenantId, lot.id, JSON.stringify(attributes), metadata.station ?? null, probedAt, ctx.chuckTemperatureK, ctx.job.id],
    );
    return { id: lot.id, probedAt };
  }
  const inserted = await client.query(
    `insert into lots (tenant_id, lot_number, product_id, customer_id, status, chuck_temperature_k, station, probed_at, attributes, last_job_id)
     values ($1, $2, $3, $4, 'probed', $5, $6, $7, $8, $9) returning id`,
    [ctx.job.tenantId, ctx.job.lotNumber, productId, customerId, ctx.chuckTemperatureK, metadata.station ?? null, probedAt, JSON.stringify(attributes), ctx.job.id],
  );
  return { id: inserted.rows[0].id, probedAt };
}

/**
 * Runs one claimed ingest job in a single transaction: a failure or a crash leaves the lot as it was (§4).
 * The job is marked done in the same transaction, fenced by its attempt number.
 */
export async function runIngestJob(job: ClaimedJob): Promise<"done" | "failed" | "retry"> {
  const started = Date.now();
  const scope = systemScope(job.tenantId, `ingest job ${job.id}`);
  const { product, file, customerId } = await withScope(scope, async (tx) => {
    const p = await getProduct(tx, job.productCode).catch(() => null);
    const f = await tx.selectFrom("raw_files").select(["object_key", "size_bytes"]).where("id", "=", job.rawFileId).executeTakeFirstOrThrow();
    return { product: p, file: f, customerId: p?.customerId ?? null };
  });
  if (!product) {
    await failJob(job, { code: "unknown_product", line: null, message: `unknown product "${job.productCode}"` });
    return "failed";
  }
  const settings: ExtractionSettings = {
    windowFactor: product.windowFactor, nonlinearityMax: product.nonlinearityMax, openBelowS: product.openBelowS,
    shortAboveS: product.shortAboveS, specLowS: product.specLowS, specHighS: product.specHighS,
  };
  const ctx: Context = { job, settings, chuckTemperatureK: job.chuckTemperatureK ?? 300 };
  const client = await pool.connect();
  const stages = stageClock();
  let warnings: unknown[] = [];
  let judgedLotId: string | null = null;
  let bytesRead = 0;
  const lease = keepLease(job, () => (0.9 * bytesRead) / Math.max(1, Number(file.size_bytes)));
  try {
    await client.query("begin");
    await client.query("select set_config('app.tenant_id', $1, true)", [job.tenantId]);
    // No JIT compilation in the job: its statements are large but simple, and compiling them cost more than it
    // saved (1,127,675 dies: the wafer aggregates 2.9 s with JIT, 0.43 s of it compiling, against 2.4 s without;
    // the out-of-window update 1.3–1.6 s against 0.8–1.1 s).
    await client.query("set local jit = off");
    await client.query(CREATE_TMP_DIES);
    await client.query(INDEX_TMP_DIES);
    // The lot is taken (and locked) as soon as the header is read, before any die: its dies go in as they come.
    const streamed = await streamDies(client, ctx, lease, file.object_key, (b) => (bytesRead = b), async (header) => {
      const lot = await upsertLot(client, ctx, product.id, customerId, product.code, header.metadata);
      return { tenantId: job.tenantId, lotId: lot.id, jobId: job.id, probedAt: lot.probedAt, slots: new Set(), mayRepeat: false, savepoints: 0 };
    });
    stages.lap(`stream (${streamed.segments} segments)`);
    warnings = streamed.summary.warnings;
    const placement = streamed.placement;
    // Only when a segment met a die already in place can a die have come in fragments.
    const { repeated, extraFragments } = placement.mayRepeat ? await findRepeatedDies(client) : { repeated: null, extraFragments: 0 };
    if (repeated) await mergeRepeatedDies(client, ctx, placement, repeated);
    // A temp table has no statistics until analysed: without them the planner misjudges the set-based steps below
    // (it took tmp_dies for a few hundred rows and scanned it once per wafer to find the out-of-window dies).
    // Only the columns those steps group and join by: all columns, the sweeps included, took twice as long
    // (125,000 dies: 0.22–0.27 s against 0.10–0.14 s).
    await client.query("analyze tmp_dies (wafer_slot, x, y, bin)");
    stages.lap("merge");
    const staticWindow = product.dieWindow === "static" ? await staticWindowInForce(client, job.tenantId, product.id, placement.probedAt) : null;
    const finished = await finishWafers(client, placement, product.dieWindow, product.dieWindowK, staticWindow);
    stages.lap("wafers");
    await refreshLotTotals(client, placement, finished);
    const report: IngestReport = {
      rows: streamed.summary.rows, skippedRows: streamed.summary.skippedRows, warningsOmitted: streamed.summary.warningsOmitted,
      dies: streamed.summary.fragments - extraFragments, wafers: finished.slots, ignoredColumns: streamed.header.ignoredColumns,
      attributes: Object.fromEntries(Object.entries(streamed.header.metadata).filter(([k]) => !RESERVED_METADATA.has(k))),
      bins: finished.binCounts, seconds: (Date.now() - started) / 1000,
    };
    await client.query("select set_config('app.job_runner', 'on', true)");
    const done = await client.query(
      `update ingest_jobs set status = 'done', progress = 1, finished_at = clock_timestamp(), lease_until = null, error_message = null, error_code = null, error_line = null,
              warnings = $3, report = $4 where tenant_id = $1 and id = $2 and attempts = $5 and status = 'running'`,
      [job.tenantId, job.id, JSON.stringify(warnings), JSON.stringify(report), job.attempts],
    );
    if (done.rowCount !== 1) throw new Error("the job's lease was taken over by another worker");
    stages.lap("totals and report");
    await client.query("commit");
    stages.lap("commit");
    console.info(`ingest job ${job.id}: ${report.dies} dies in ${stages.summary()}`);
    judgedLotId = placement.lotId;
    return "done";
  } catch (error) {
    await client.query("rollback").catch(() => undefined);
    if (error instanceof ProbeFileError) {
      await failJob(job, { code: error.code, line: error.line, message: error.message }, warnings);
      return "failed";
    }
    if (error instanceof AppError) {
      await failJob(job, { code: error.code, line: null, message: error.message }, warnings);
      return "failed";
    }
    console.error(`ingest job ${job.id} attempt ${job.attempts}:`, error);
    await retryJob(job, error instanceof Error ? error.message : String(error));
    return "retry";
  } finally {
    lease.stop();
    client.release();
    // Judged in its own transaction after the commit, so a judging failure never loses the ingest.
    if (judgedLotId) await judgeAfterIngest(job.tenantId, judgedLotId, job.id);
  }
}
