import { readdirSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { fixtureBytes, probeText, readAll, tinyChunks } from "@/domain/probe-file/probe-file-test-support";
import { Worker } from "node:worker_threads";
import { afterAll } from "vitest";
import { fragmentItems, type ReadOptions } from "@/domain/probe-file";
import { ProbeThreads, readProbeFileBatchesInThread } from "./read-in-thread";

// The app starts its threads from its bundle; here they start from source, through tsx.
let started = 0;
const threads = new ProbeThreads(() => {
  started++;
  return new Worker(new URL("../../test/tsx-thread.mjs", import.meta.url), { argv: [new URL("./probe-thread.ts", import.meta.url).href] });
});
afterAll(() => threads.close());
// Fragment by fragment, as readProbeFile yields them, to compare the two whole.
const readProbeFileInThread = (source: AsyncIterable<Uint8Array>, options?: ReadOptions) => fragmentItems(readProbeFileBatchesInThread(source, options, threads));

const FIXTURES = readdirSync(new URL("../../../fixtures/probe/", import.meta.url)).filter((name) => name.endsWith(".csv"));

/** The bytes in chunks of `size`. */
async function* chunks(bytes: Uint8Array, size: number): AsyncGenerator<Uint8Array> {
  for (let at = 0; at < bytes.length; at += size) yield bytes.slice(at, at + size);
}

/** A lot of `dies` dies over three wafers, 11 points each, with a site column and a die that comes back later. */
function bigLot(dies: number): Uint8Array {
  const rows: string[] = [];
  for (let d = 0; d < dies; d++) {
    for (let k = 0; k < 11; k++) rows.push(`${1 + (d % 3)},${d},${-d},${(k - 5) * 2},${(k - 5) * 2 * (1 + d / dies)},S${d % 4}`);
  }
  rows.push("1,0,0,12,18.5,S0"); // die (1, 0, 0) again: a second fragment
  return new TextEncoder().encode(probeText("wafer,die_x,die_y,bias_mv,current_na,site", rows));
}

describe("readProbeFileInThread", () => {
  it.each(FIXTURES)("reads %s exactly as readProbeFile does: header, fragments, summary or refusal with its line", async (name) => {
    const direct = await readAll(tinyChunks(fixtureBytes(name)));
    const threaded = await readAll(tinyChunks(fixtureBytes(name)), undefined, readProbeFileInThread);
    expect(threaded).toEqual(direct);
    if (direct.error) expect(threaded.error?.message).toBe(direct.error.message);
  });

  it("gives the same dies for a file of many chunks, and reports progress up to the last byte", async () => {
    const bytes = bigLot(6000);
    const progress: number[] = [];
    const direct = await readAll(chunks(bytes, 65_536));
    const threaded = await readAll(chunks(bytes, 3_000), { onProgress: (n) => progress.push(n) }, readProbeFileInThread);
    expect(threaded.fragments).toHaveLength(6001);
    expect(threaded).toEqual(direct);
    expect(progress.at(-1)).toBe(bytes.length);
    expect(progress.every((n, i) => i === 0 || n >= progress[i - 1]!)).toBe(true);
  });

  it("applies the error budget sent to the thread", async () => {
    const rows = Array.from({ length: 99 }, (_, i) => `1,${Math.floor(i / 11)},0,${i % 11},${i % 11}`).concat(["1,x,0,1,1"]);
    const bytes = new TextEncoder().encode(probeText("wafer,die_x,die_y,bias_mv,current_na", rows));
    const strict = await readAll(chunks(bytes, 100), { errorBudgetFraction: 0 }, readProbeFileInThread);
    expect(strict.error).toMatchObject({ code: "bad_value", line: 103 });
    const lenient = await readAll(chunks(bytes, 100), { errorBudgetFraction: 0.05 }, readProbeFileInThread);
    expect(lenient.summary).toMatchObject({ rows: 100, skippedRows: 1 });
  });

  it("reads no further than its consumer takes, and stops the source when the consumer stops", async () => {
    const bytes = bigLot(20_000);
    let pulled = 0;
    let closed = false;
    async function* counted(): AsyncGenerator<Uint8Array> {
      try {
        for await (const chunk of chunks(bytes, 16_384)) {
          pulled += chunk.length;
          yield chunk;
        }
      } finally {
        closed = true;
      }
    }
    const reader = readProbeFileInThread(counted());
    let fragments = 0;
    for await (const item of reader) if (item.kind === "fragment" && ++fragments === 100) break;
    expect(closed).toBe(true);
    // 100 dies are ~25 kB of the 2.5 MB file: the reader had at most a few chunks in flight beyond them.
    expect(pulled).toBeLessThan(1_000_000);
  });

  it("fails with an Error naming the thread when the source itself fails", async () => {
    async function* broken(): AsyncGenerator<Uint8Array> {
      yield fixtureBytes("good-small.csv").slice(0, 100);
      throw new Error("connection reset");
    }
    await expect(readAll(broken(), undefined, readProbeFileInThread)).rejects.toThrow("connection reset");
  });

  it("keeps its thread for the next file after a refusal, dropping the refused file's chunks still in flight", async () => {
    const good = bigLot(3000);
    const expected = await readAll(chunks(good, 65_536));
    await readAll(chunks(good, 4_096), undefined, readProbeFileInThread); // a thread is waiting now
    const before = started;
    // Refused on its header line, while chunks of its 200 kB are still on their way to the thread.
    const refused = await readAll(chunks(new TextEncoder().encode(probeText("wafer,die_x,bias_mv,current_na", Array(20_000).fill("1,0,1,1"))), 512), undefined, readProbeFileInThread);
    expect(refused.error).toMatchObject({ code: "missing_column", line: 3 });
    expect(await readAll(chunks(good, 1_000), undefined, readProbeFileInThread)).toEqual(expected);
    expect(started).toBe(before);
  });

  it("stops a thread whose read was abandoned, and starts another for the next file", async () => {
    await readAll(chunks(bigLot(10), 100), undefined, readProbeFileInThread);
    const before = started;
    for await (const item of readProbeFileInThread(chunks(bigLot(5000), 8_192))) if (item.kind === "fragment") break;
    const again = await readAll(chunks(bigLot(10), 100), undefined, readProbeFileInThread);
    expect(again.fragments).toHaveLength(11);
    expect(started).toBe(before + 1);
  });
});
