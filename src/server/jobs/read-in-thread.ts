import "server-only";
import { Worker } from "node:worker_threads";
import { type ProbeFileBatchItem, ProbeFileError, type ProbeFileSummary, type ReadOptions } from "@/domain/probe-file";
import type { FromThread, ThreadReadOptions, ToThread } from "./probe-thread-protocol";

// Bytes go to the thread in chunks of at least this size, at most IN_FLIGHT at a time: the thread always has the
// next chunk to parse while this thread handles the fragments of the last, and no more than ~0.5 MB waits. The
// thread hands each chunk's buffer back once the parser is done with it, so a read reuses a handful of buffers:
// one new buffer per chunk left up to ~50 MB of them waiting for the thread's garbage collector.
const CHUNK_BYTES = 128 * 1024;
const CHUNK_CAPACITY = 2 * CHUNK_BYTES;
const IN_FLIGHT = 3;

/**
 * Threads for reading probe files, one file at a time each. A thread that finished its file (read to the end or
 * refused) is kept for the next one, so a job does not start a thread and compile csv-parse afresh. A thread whose
 * read was abandoned or failed is stopped instead. At most `keep` wait, unreferenced, so they never hold the
 * process open.
 */
export class ProbeThreads {
  private readonly idle: Worker[] = [];

  constructor(
    private readonly create: () => Worker,
    private readonly keep = 1,
  ) {}

  acquire(): Worker {
    const thread = this.idle.pop();
    if (thread) {
      thread.ref();
      return thread;
    }
    const fresh = this.create();
    fresh.once("exit", () => {
      const at = this.idle.indexOf(fresh);
      if (at >= 0) this.idle.splice(at, 1);
    });
    return fresh;
  }

  /** Back to the pool after a read that ended with its final message. */
  release(thread: Worker): void {
    if (this.idle.length >= this.keep) {
      void thread.terminate();
      return;
    }
    thread.unref();
    this.idle.push(thread);
  }

  async discard(thread: Worker): Promise<void> {
    await thread.terminate();
  }

  /** Stops the waiting threads (tests). */
  async close(): Promise<void> {
    await Promise.all(this.idle.splice(0).map((t) => t.terminate()));
  }
}

// The thread's garbage is csv-parse's strings, a few per field: a young generation of at most 32 MB is plenty for
// it, and keeps the thread's heap from growing to the app's (src/cli/app.ts APP_NODE_FLAGS).
const appThreads = new ProbeThreads(() => new Worker(new URL("./probe-thread.ts", import.meta.url), { resourceLimits: { maxYoungGenerationSizeMb: 32 } }));
let reads = 0;

/**
 * readProbeFileBatches run in a worker thread: the same header, fragments, summary and refusals (with their
 * lines), but parsing overlaps whatever the caller does with each batch. The source is read only as fast as
 * batches are taken, so memory stays bounded as with readProbeFile. A thread that fails for any other reason
 * throws an Error.
 */
export async function* readProbeFileBatchesInThread(
  source: AsyncIterable<Uint8Array>,
  options: ReadOptions = {},
  threads: ProbeThreads = appThreads,
): AsyncGenerator<ProbeFileBatchItem, ProbeFileSummary, undefined> {
  const { onProgress, ...threadOptions } = options;
  const read = ++reads;
  const thread = threads.acquire();
  const inbox: FromThread[] = [];
  let wake: (() => void) | null = null;
  const arrive = (message: FromThread) => {
    if (message.read !== read) return;
    inbox.push(message);
    wake?.();
    wake = null;
  };
  const failed = (error: Error) => arrive({ read, kind: "crashed", message: error.stack ?? error.message });
  // Its last message is delivered before this event, so after "done" or a refusal it is never read.
  const exited = (code: number) => arrive({ read, kind: "crashed", message: `the thread stopped (exit code ${code}) before the end of the file` });
  thread.on("message", arrive);
  thread.on("error", failed);
  thread.on("exit", exited);

  const input = source[Symbol.asyncIterator]();
  const post = (message: ToThread, transfer: ArrayBuffer[] = []) => thread.postMessage(message, transfer);
  const inFlight: number[] = []; // byte sizes of the chunks sent and not yet answered
  const spare: ArrayBuffer[] = []; // chunk buffers the thread gave back
  let filling: Uint8Array | null = null;
  let filled = 0;
  let ended = false;
  let finished = false; // the thread sent its final message for this read
  let consumedBytes = 0;

  const flush = () => {
    if (filling === null || filled === 0) return;
    inFlight.push(filled);
    post({ kind: "chunk", read, bytes: filling.subarray(0, filled) }, [filling.buffer as ArrayBuffer]);
    filling = null;
    filled = 0;
  };
  // The source's pieces are copied into chunk buffers of our own (a stream's pieces may share a pooled buffer),
  // which go to the thread and come back to be filled again.
  const add = (piece: Uint8Array) => {
    if (filling !== null && filled + piece.length > filling.length) flush();
    if (piece.length > CHUNK_CAPACITY) {
      inFlight.push(piece.length);
      const own = new Uint8Array(piece);
      post({ kind: "chunk", read, bytes: own }, [own.buffer]);
      return;
    }
    filling ??= new Uint8Array(spare.pop() ?? new ArrayBuffer(CHUNK_CAPACITY));
    filling.set(piece, filled);
    filled += piece.length;
    if (filled >= CHUNK_BYTES) flush();
  };
  const topUp = async () => {
    while (!ended && inFlight.length < IN_FLIGHT) {
      const next = await input.next();
      if (next.done) {
        flush();
        post({ kind: "end", read });
        ended = true;
      } else add(next.value);
    }
  };

  post({ kind: "start", read, options: threadOptions });
  try {
    for (;;) {
      await topUp();
      while (inbox.length === 0) await new Promise<void>((resolve) => (wake = resolve));
      const message = inbox.shift()!;
      switch (message.kind) {
        case "header":
          yield { kind: "header", header: message.header };
          break;
        case "batch":
          yield { kind: "batch", batch: message.batch };
          break;
        case "consumed":
          consumedBytes += inFlight.shift() ?? 0;
          if (message.returned?.byteLength === CHUNK_CAPACITY && spare.length <= IN_FLIGHT) spare.push(message.returned);
          onProgress?.(consumedBytes);
          break;
        case "done":
          finished = true;
          return message.summary;
        case "refused":
          finished = true;
          throw new ProbeFileError(message.code, message.line, message.reason);
        case "crashed":
          throw new Error(`the probe-file reader thread failed: ${message.message}`);
      }
    }
  } finally {
    thread.off("message", arrive);
    thread.off("error", failed);
    thread.off("exit", exited);
    await Promise.all([finished ? threads.release(thread) : threads.discard(thread), ended ? undefined : input.return?.()]);
  }
}
