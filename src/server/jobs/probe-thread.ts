// The body of the thread that reads probe files for ingest jobs (started by read-in-thread.ts): csv-parse, the §4
// checks and the grouping into die fragments run here, so the job's own thread can fit and encode the dies of one
// chunk while this one parses the next. It reads one file at a time and then waits for the next. No server
// imports: it sees only the bytes it is sent.
import { parentPort } from "node:worker_threads";
import { ProbeFileError, readProbeFileBatches, transferables } from "@/domain/probe-file";
import type { FromThread, ThreadReadOptions, ToThread } from "./probe-thread-protocol";

const port = parentPort!;
let current = 0; // the read under way; messages of any other are left over from one that ended early
const starts: { read: number; options: ThreadReadOptions }[] = [];
const inbox: (Uint8Array | null)[] = [];
let wake: (() => void) | null = null;
port.on("message", (message: ToThread) => {
  // A read starts only once the last one has sent its final message, so its chunks may follow at once.
  if (message.kind === "start") {
    current = message.read;
    inbox.length = 0;
    starts.push(message);
  } else if (message.read === current) inbox.push(message.kind === "chunk" ? message.bytes : null);
  else return;
  wake?.();
  wake = null;
});

const waitForMessage = () => new Promise<void>((resolve) => (wake = resolve));

function send(message: FromThread): void {
  const transfer = message.kind === "batch" ? transferables(message.batch) : message.kind === "consumed" && message.returned ? [message.returned] : [];
  port.postMessage(message, transfer);
}

/** The chunks of the current read as they arrive; asking for the next one means the reader is done with the last. */
async function* chunks(read: number): AsyncGenerator<Uint8Array> {
  let previous: Uint8Array | null = null;
  for (;;) {
    while (inbox.length === 0) await waitForMessage();
    const chunk = inbox.shift()!;
    if (chunk === null) return;
    yield chunk;
    // The reader has parsed `chunk`, so nothing refers to the chunk before it any more.
    send({ read, kind: "consumed", returned: previous === null ? null : (previous.buffer as ArrayBuffer) });
    previous = chunk;
  }
}

async function readOne(read: number, options: ThreadReadOptions): Promise<void> {
  try {
    const reader = readProbeFileBatches(chunks(read), options);
    for (;;) {
      const next = await reader.next();
      if (next.done) return send({ read, kind: "done", summary: next.value });
      if (next.value.kind === "header") send({ read, kind: "header", header: next.value.header });
      else if (next.value.batch.count > 0) send({ read, kind: "batch", batch: next.value.batch });
    }
  } catch (error) {
    if (error instanceof ProbeFileError) send({ read, kind: "refused", code: error.code, line: error.line, reason: error.reason });
    else send({ read, kind: "crashed", message: error instanceof Error ? (error.stack ?? error.message) : String(error) });
  }
}

for (;;) {
  while (starts.length === 0) await waitForMessage();
  const { read, options } = starts.shift()!;
  await readOne(read, options);
  current = 0;
  inbox.length = 0;
}
