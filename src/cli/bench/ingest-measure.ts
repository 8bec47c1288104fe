// One measured ingest: upload, queue, job, with the app process's resident memory sampled throughout.
import type { JobView } from "@/lib/schemas/ingest";
import { type BenchTenant, uploadFile, waitForJob, waitForJudging } from "./ingest-client";
import { treeCpuSeconds } from "./proc-stats";
import type { RssSampler } from "./rss-sampler";

/** The processes whose CPU time a run adds up: the app (its job and upload), PostgreSQL and the object store. */
export interface ServicePids {
  app: number;
  postgres: number | null;
  objectStore: number | null;
}

export interface CpuSplit {
  app: number;
  postgres: number;
  objectStore: number;
}

export interface IngestRun {
  job: JobView;
  /** Upload start → 202 (the file is in the object store and the job queued). */
  uploadSeconds: number;
  /** Job created → claimed by the worker, by the database's clock (the worker's poll interval). */
  queuedSeconds: number;
  /** The job's own clock: claimed → just before commit (report.seconds). */
  jobSeconds: number;
  /** Upload start → first poll that sees the job done. */
  totalSeconds: number;
  /** Done → the job's report carries the SPC judging that follows the commit (NaN when it never came). */
  judgeSeconds: number;
  idleRssBytes: number;
  peakUploadRssBytes: number;
  peakJobRssBytes: number;
  peakJudgeRssBytes: number;
  /** Peak of the app process alone (the tree figures add its children, if any). */
  peakOwnRssBytes: number;
  /** CPU seconds of each service during the upload (start → 202) and after it (→ done seen). */
  uploadCpu: CpuSplit;
  jobCpu: CpuSplit;
  judgeCpu: CpuSplit;
}

function cpuNow(pids: ServicePids): CpuSplit {
  const of = (pid: number | null) => (pid === null ? 0 : treeCpuSeconds(pid));
  return { app: of(pids.app), postgres: of(pids.postgres), objectStore: of(pids.objectStore) };
}

function cpuBetween(a: CpuSplit, b: CpuSplit): CpuSplit {
  return { app: b.app - a.app, postgres: b.postgres - a.postgres, objectStore: b.objectStore - a.objectStore };
}

export const cpuTotal = (c: CpuSplit) => c.app + c.postgres + c.objectStore;

export const mb = (bytes: number) => bytes / 2 ** 20;

/** Uploads `path` and waits for its job; with `timelineEverySeconds`, prints RSS and progress at that interval. */
export async function measureIngest(t: BenchTenant, path: string, sampler: RssSampler, pids: ServicePids, timeoutMs: number, timelineEverySeconds = 0): Promise<IngestRun> {
  const idleRssBytes = sampler.now().treeBytes;
  const cpu0 = cpuNow(pids);
  const t0 = sampler.elapsedMs();
  let phase = "upload";
  let latest: JobView | null = null;
  let ticker: NodeJS.Timeout | null = null;
  if (timelineEverySeconds > 0) {
    ticker = setInterval(() => {
      const s = sampler.now();
      const progress = latest ? ` ${(100 * latest.progress).toFixed(0)} %` : "";
      const elapsed = ((sampler.elapsedMs() - t0) / 1000).toFixed(0).padStart(5);
      process.stdout.write(`  ${elapsed} s  ${phase.padEnd(8)}${progress.padEnd(6)}  app RSS ${mb(s.ownBytes).toFixed(0).padStart(5)} MB (tree ${mb(s.treeBytes).toFixed(0)} MB)\n`);
    }, timelineEverySeconds * 1000);
  }
  try {
    const queued = await uploadFile(t, path);
    const t1 = sampler.elapsedMs();
    const cpu1 = cpuNow(pids);
    phase = "queued";
    // Polled every 25 ms: a coarser poll added up to its own interval to the end-to-end time (250 ms added ~0.13 s on average).
    const job = await waitForJob(t, queued.id, timeoutMs, 25, (j) => {
      latest = j;
      phase = j.status;
    });
    const t2 = sampler.elapsedMs();
    const cpu2 = cpuNow(pids);
    if (job.status !== "done") throw new Error(`job ${job.id} ${job.status}: ${job.error?.message ?? "no message"}`);
    phase = "judging";
    const judged = await waitForJudging(t, job.id, timeoutMs / 3);
    const t3 = sampler.elapsedMs();
    const cpu3 = cpuNow(pids);
    return {
      job,
      uploadSeconds: (t1 - t0) / 1000,
      queuedSeconds: job.startedAt ? (Date.parse(job.startedAt) - Date.parse(job.createdAt)) / 1000 : Number.NaN,
      jobSeconds: job.report?.seconds ?? Number.NaN,
      totalSeconds: (t2 - t0) / 1000,
      judgeSeconds: judged ? (t3 - t2) / 1000 : Number.NaN,
      idleRssBytes,
      peakUploadRssBytes: sampler.peak(t0, t1).treeBytes,
      peakJobRssBytes: sampler.peak(t1, t2).treeBytes,
      peakJudgeRssBytes: sampler.peak(t2, t3).treeBytes,
      peakOwnRssBytes: sampler.peak(t0, t3).ownBytes,
      uploadCpu: cpuBetween(cpu0, cpu1),
      jobCpu: cpuBetween(cpu1, cpu2),
      judgeCpu: cpuBetween(cpu2, cpu3),
    };
  } finally {
    if (ticker) clearInterval(ticker);
  }
}
