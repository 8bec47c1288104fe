// The benchmark's printed figures: one row per file, then the ratios the issue sets targets for.
import type { WrittenLot } from "./ingest-lot-file";
import { type CpuSplit, cpuTotal, type IngestRun, mb } from "./ingest-measure";
import type { ParseRun } from "./ingest-parse-alone";

export interface BenchRow {
  name: string;
  file: WrittenLot;
  parse: ParseRun;
  ingest: IngestRun;
  /** Each try's own csv-parse alone and end-to-end seconds, when the row is the best of several. */
  tries?: { parseSeconds: number; totalSeconds: number }[];
}

// Targets from the issue: end-to-end within 2× csv-parse alone; peak RSS within 512 MB and flat in file size.
const MAX_RATIO = 2;
const MAX_PEAK_RSS_MB = 512;

/** Peak over the upload, the job and the judging that follows it: all of it runs in the app process. */
const peakOf = (r: IngestRun) => Math.max(r.peakUploadRssBytes, r.peakJobRssBytes, r.peakJudgeRssBytes);

const kRate = (rows: number, seconds: number) => `${(rows / seconds / 1000).toFixed(0)} k/s`;

function table(header: string[], rows: string[][]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? "").length)));
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join("  ");
  return [line(header), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n");
}

/** True when the job read every row and die of the file (a truncated upload would flatter every figure). */
export function isComplete(row: BenchRow): boolean {
  const report = row.ingest.job.report;
  return report !== null && report.rows === row.file.rows && report.dies === row.file.dies && report.skippedRows === 0;
}

/** The figures table, the per-stage split and the target lines, as text. */
export function formatReport(rows: BenchRow[]): string {
  const figures = table(
    ["file", "MB", "rows", "dies", "parse alone", "upload s", "queued s", "job s", "end-to-end", "e2e/parse", "job/parse", "judge s", "idle RSS", "peak RSS up/job/judge"],
    rows.map(({ name, file, parse, ingest: r }) => [
      name, mb(file.bytes).toFixed(0), file.rows.toLocaleString("en"), file.dies.toLocaleString("en"),
      `${parse.seconds.toFixed(2)} s ${kRate(file.rows, parse.seconds)}`,
      r.uploadSeconds.toFixed(2), r.queuedSeconds.toFixed(2), r.jobSeconds.toFixed(2),
      `${r.totalSeconds.toFixed(2)} s ${kRate(file.rows, r.totalSeconds)}`,
      `${(r.totalSeconds / parse.seconds).toFixed(2)}×`, `${(r.jobSeconds / parse.seconds).toFixed(2)}×`, r.judgeSeconds.toFixed(2),
      `${mb(r.idleRssBytes).toFixed(0)} MB`, `${[r.peakUploadRssBytes, r.peakJobRssBytes, r.peakJudgeRssBytes].map((b) => mb(b).toFixed(0)).join(" / ")} MB`,
    ]),
  );
  const split = (c: CpuSplit) => `${c.app.toFixed(1)} / ${c.postgres.toFixed(1)} / ${c.objectStore.toFixed(1)}`;
  const cpu = table(
    ["file", "parse alone", "upload app/pg/s3", "job app/pg/s3", "total", "total/parse", "judge app/pg/s3"],
    rows.map(({ name, parse, ingest: r }) => {
      const total = cpuTotal(r.uploadCpu) + cpuTotal(r.jobCpu);
      return [name, parse.cpuSeconds.toFixed(2), split(r.uploadCpu), split(r.jobCpu), total.toFixed(1), `${(total / parse.cpuSeconds).toFixed(2)}×`, split(r.judgeCpu)];
    }),
  );
  const notes: string[] = [];
  for (const { name, file, ingest: r } of rows) {
    const report = r.job.report;
    if (!isComplete({ name, file, parse: rows[0]!.parse, ingest: r })) {
      notes.push(`${name}: INCOMPLETE: the job saw ${report?.rows ?? 0} of ${file.rows} rows and ${report?.dies ?? 0} of ${file.dies} dies ` +
        `(${r.job.sizeBytes} of ${file.bytes} bytes stored); its figures do not measure the whole file`);
    }
  }
  for (const { name, ingest: r } of rows) {
    if (Number.isNaN(r.judgeSeconds)) notes.push(`${name}: the SPC judging after the commit never reported into the job (see the app log)`);
  }
  for (const { name, parse, ingest: r, tries } of rows) {
    const ratio = r.totalSeconds / parse.seconds;
    const peak = mb(peakOf(r));
    const each = tries && tries.length > 1 ? `; try by try ${tries.map((t) => `${(t.totalSeconds / t.parseSeconds).toFixed(2)}×`).join(", ")}` : "";
    notes.push(`${name}: end-to-end ${ratio.toFixed(2)}× parse-alone, best against best (target ≤ ${MAX_RATIO}×: ${ratio <= MAX_RATIO ? "met" : "missed"})${each}; ` +
      `peak RSS ${peak.toFixed(0)} MB (target ≤ ${MAX_PEAK_RSS_MB} MB: ${peak <= MAX_PEAK_RSS_MB ? "met" : "missed"})`);
  }
  const [base, ...larger] = rows;
  for (const other of base ? larger : []) {
    const growth = (peakOf(other.ingest) - other.ingest.idleRssBytes) / Math.max(1, peakOf(base!.ingest) - base!.ingest.idleRssBytes);
    notes.push(`${other.name} vs ${base!.name}: file ${(other.file.bytes / base!.file.bytes).toFixed(1)}×, peak RSS ` +
      `${(peakOf(other.ingest) / peakOf(base!.ingest)).toFixed(2)}× (above idle: ${growth.toFixed(2)}×)`);
  }
  return `${figures}\n\nCPU seconds (user + system) of each process, summed over its children; on a shared machine they vary less than wall time:\n${cpu}\n\n${notes.join("\n")}\n`;
}
