import { afterAll, describe, expect, it } from "vitest";
import type pg from "pg";
import { ownerPool } from "@/test/tenants";
import { SegmentedCopy } from "./segmented-copy";

const pool = ownerPool();
afterAll(() => pool.end());

// Binary COPY (PostgreSQL documentation, "COPY", "Binary Format"): signature, flags, extension length; tuples of
// an int16 field count and length-prefixed fields; int16 −1 at the end.
const HEADER = Buffer.concat([Buffer.from("PGCOPY\n\xff\r\n\0", "latin1"), Buffer.alloc(8)]);
const TRAILER = Buffer.from([0xff, 0xff]);

/** Tuples of one int4 column, the values given. */
function tuples(values: number[]): Buffer {
  const out = Buffer.alloc(values.length * 10);
  values.forEach((v, i) => {
    out.writeInt16BE(1, i * 10);
    out.writeInt32BE(4, i * 10 + 2);
    out.writeInt32BE(v, i * 10 + 6);
  });
  return out;
}

async function inTransaction(run: (client: pg.PoolClient) => Promise<void>) {
  const client = await pool.connect();
  try {
    await client.query("begin");
    await client.query("create temp table seg (v int4) on commit drop");
    await client.query("create temp table moved (v int4, segment int4) on commit drop");
    await run(client);
  } finally {
    await client.query("rollback").catch(() => undefined);
    client.release();
  }
}

function writer(client: pg.PoolClient, flush: (after: number, upTo: number) => Promise<void>, segmentBytes = 100, maxQueuedBytes = 1_000_000) {
  return new SegmentedCopy(client, { copySql: "copy seg (v) from stdin with (format binary)", header: HEADER, trailer: TRAILER, flush, segmentBytes: () => segmentBytes, maxQueuedBytes });
}

describe("COPY in segments, each flushed on the same connection while the producer goes on", () => {
  it("writes every tuple once, in order, in segments of about the asked size, each flushed before the next COPY", async () => {
    await inTransaction(async (client) => {
      let segment = 0;
      const ranges: [number, number][] = [];
      const copy = writer(client, async (after, upTo) => {
        segment++;
        ranges.push([after, upTo]);
        await client.query("insert into moved select v, $1 from seg", [segment]);
        await client.query("truncate seg");
      });
      // 50 writes of 3 tuples (30 bytes each), marked 1 to 50: a segment closes once 100 bytes are in, so after
      // every fourth write.
      for (let i = 0; i < 50; i++) await copy.write(tuples([3 * i, 3 * i + 1, 3 * i + 2]), i + 1);
      await copy.end();
      expect(copy.segments).toBe(13);
      expect(ranges).toEqual([...Array(13).keys()].map((k) => [4 * k, Math.min(50, 4 * k + 4)]));
      const { rows } = await client.query("select v, segment from moved order by v");
      expect(rows.map((r) => r.v)).toEqual([...Array(150).keys()]);
      expect(rows.filter((r) => r.segment === 1).map((r) => r.v)).toEqual([...Array(12).keys()]);
      expect(rows.at(-1)!.segment).toBe(13);
    });
  });

  it("takes writes while a flush is running, up to maxQueuedBytes, and then waits for it", async () => {
    await inTransaction(async (client) => {
      let release: () => void = () => undefined;
      let flushes = 0;
      const copy = writer(client, async () => {
        flushes++;
        if (flushes === 1) await new Promise<void>((resolve) => (release = resolve));
        await client.query("truncate seg");
      }, 30, 60);
      await copy.write(tuples([1, 2, 3]), 1); // fills the first segment, whose flush then hangs
      await new Promise((resolve) => setTimeout(resolve, 50));
      expect(flushes).toBe(1);
      await copy.write(tuples([4, 5, 6]), 2);
      await copy.write(tuples([7, 8, 9]), 3); // 60 bytes queued: still accepted
      let accepted = false;
      const third = copy.write(tuples([10, 11, 12]), 4).then(() => (accepted = true));
      await new Promise((resolve) => setTimeout(resolve, 50));
      expect(accepted).toBe(false);
      release();
      await third;
      await copy.end();
      expect(flushes).toBe(4);
    });
  });

  it("passes on PostgreSQL's refusal of a tuple, and leaves the connection able to roll back", async () => {
    await inTransaction(async (client) => {
      const copy = writer(client, async () => undefined, 1_000);
      const bad = Buffer.from([0x00, 0x02, 0, 0, 0, 4, 0, 0, 0, 1]); // says two fields, the table has one
      const failure = (async () => {
        await copy.write(bad, 1);
        await copy.end();
      })();
      await expect(failure).rejects.toThrow(/field count|row field count/i);
      await client.query("rollback");
      expect((await client.query("select 1 as one")).rows[0].one).toBe(1);
    });
  });

  it("fails the writes after a failed flush, with the flush's error", async () => {
    await inTransaction(async (client) => {
      const copy = writer(client, async () => {
        throw new Error("flush refused");
      }, 10);
      await copy.write(tuples([1]), 1);
      await new Promise((resolve) => setTimeout(resolve, 50));
      await expect(copy.write(tuples([2]), 2)).rejects.toThrow("flush refused");
      await expect(copy.end()).rejects.toThrow("flush refused");
    });
  });

  it("cancels an open COPY when aborted, flushes nothing more, and leaves the connection able to roll back", async () => {
    await inTransaction(async (client) => {
      let flushes = 0;
      const copy = writer(client, async () => void flushes++, 1_000_000);
      await copy.write(tuples([1, 2, 3]), 1);
      await new Promise((resolve) => setTimeout(resolve, 50)); // the COPY is open, waiting for more
      await copy.abort(new Error("the file was refused"));
      expect(flushes).toBe(0);
      await expect(copy.write(tuples([4]), 2)).rejects.toThrow("the file was refused");
      await client.query("rollback");
      expect((await client.query("select 1 as one")).rows[0].one).toBe(1);
    });
  });
});
