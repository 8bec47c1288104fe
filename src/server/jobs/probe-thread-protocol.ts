import type { FragmentBatch, ProbeFileErrorCode, ProbeFileHeader, ProbeFileSummary, ReadOptions } from "@/domain/probe-file";

// Messages between ingest jobs and the thread that reads their probe files (probe-thread.ts). Plain data only:
// they cross the thread boundary by structured clone, the batches' buffers by transfer. One thread reads one file
// at a time and is kept for the next; every message names its file's `read` number, so whatever is left of a read
// that ended early (chunks sent before a refusal) is dropped instead of reaching the next.

export type ThreadReadOptions = Omit<ReadOptions, "onProgress">;

export type ToThread =
  | { kind: "start"; read: number; options: ThreadReadOptions }
  | { kind: "chunk"; read: number; bytes: Uint8Array }
  | { kind: "end"; read: number };

export type FromThread = { read: number } & (
  | { kind: "header"; header: ProbeFileHeader }
  /** Fragments completed, in file order. */
  | { kind: "batch"; batch: FragmentBatch }
  /**
   * One answers every chunk, after that chunk's batch, so the sender can pace itself. It hands back the buffer of
   * the chunk before (csv-parse keeps a view of a chunk's unfinished last row until it has read the next chunk).
   */
  | { kind: "consumed"; returned: ArrayBuffer | null }
  /** The last message of a read, as are the two below. */
  | { kind: "done"; summary: ProbeFileSummary }
  | { kind: "refused"; code: ProbeFileErrorCode; line: number | null; reason: string }
  | { kind: "crashed"; message: string }
);
