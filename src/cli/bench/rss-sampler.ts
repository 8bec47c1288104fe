// Samples the resident memory of a process and its descendants from /proc (Linux only).
import { descendants, vmRssBytes } from "./proc-stats";

export interface RssSample {
  atMs: number;
  /** The process itself. */
  ownBytes: number;
  /** The process and all its descendants. */
  treeBytes: number;
}

/** Reads VmRSS of `pid` and its descendants every `intervalMs` (the tree is re-listed once a second). */
export class RssSampler {
  readonly samples: RssSample[] = [];
  private timer: NodeJS.Timeout | null = null;
  private tree: number[] = [];
  private listedAt = 0;
  private readonly started = Date.now();

  constructor(
    private readonly pid: number,
    private readonly intervalMs = 100,
  ) {}

  start(): this {
    this.sample();
    this.timer = setInterval(() => this.sample(), this.intervalMs);
    return this;
  }

  stop(): void {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    this.sample();
  }

  /** The latest sample. */
  now(): RssSample {
    return this.samples[this.samples.length - 1] ?? this.sample();
  }

  /** Peak tree and own RSS over samples taken in [fromMs, toMs] (ms since the sampler was made). */
  peak(fromMs = 0, toMs = Infinity): { ownBytes: number; treeBytes: number } {
    let ownBytes = 0;
    let treeBytes = 0;
    for (const s of this.samples) {
      if (s.atMs < fromMs || s.atMs > toMs) continue;
      ownBytes = Math.max(ownBytes, s.ownBytes);
      treeBytes = Math.max(treeBytes, s.treeBytes);
    }
    return { ownBytes, treeBytes };
  }

  elapsedMs(): number {
    return Date.now() - this.started;
  }

  private sample(): RssSample {
    const atMs = Date.now() - this.started;
    if (atMs - this.listedAt >= 1000 || this.samples.length === 0) {
      this.tree = descendants(this.pid);
      this.listedAt = atMs;
    }
    const ownBytes = vmRssBytes(this.pid);
    const treeBytes = this.tree.reduce((sum, pid) => sum + vmRssBytes(pid), ownBytes);
    const sample = { atMs, ownBytes, treeBytes };
    this.samples.push(sample);
    return sample;
  }
}
