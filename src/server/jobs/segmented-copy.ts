import "server-only";
import { once } from "node:events";
import { finished } from "node:stream/promises";
import type pg from "pg";
import { from as copyFrom } from "pg-copy-streams";

/**
 * Binary COPY tuples written in segments, each segment one COPY followed by `flush` on the same connection, while
 * the producer goes on: `write` only waits when more than `maxQueuedBytes` wait to be sent. This lets PostgreSQL
 * work on one segment (the job moves it into `dies`) while the job fits and encodes the next, instead of doing all
 * of that work after the file has been read.
 *
 * `header` and `trailer` open and close every COPY (binary COPY's file header and end marker); the tuples written
 * must be whole. Each write carries a mark, increasing from write to write and above 0 (the job's: the first line
 * of the last die in it); `flush(after, upTo)` gets the marks that bound its segment, the previous segment's last
 * (0 for the first) and its own last. `segmentBytes(sent)` gives the size of the next segment once `sent` bytes
 * have gone before it.
 */
export class SegmentedCopy {
  private readonly queue: { tuples: Buffer; mark: number }[] = [];
  private queued = 0;
  private ended = false;
  private failure: { error: unknown } | null = null;
  private wakePump: (() => void) | null = null;
  private wakeProducer: (() => void) | null = null;
  private open: ReturnType<typeof copyFrom> | null = null;
  private readonly pumping: Promise<void>;
  /** Segments flushed so far. */
  segments = 0;

  constructor(
    private readonly client: pg.PoolClient,
    private readonly options: {
      copySql: string;
      header: Buffer;
      trailer: Buffer;
      flush: (after: number, upTo: number) => Promise<void>;
      segmentBytes: (sent: number) => number;
      maxQueuedBytes: number;
    },
  ) {
    this.pumping = this.pump().catch((error: unknown) => {
      this.failure ??= { error };
      this.wakeProducer?.();
    });
  }

  /** Queues whole tuples; waits while too much is queued. Throws what stopped the COPY or a flush. */
  async write(tuples: Buffer, mark: number): Promise<void> {
    if (this.failure) throw this.failure.error;
    if (this.ended) throw new Error("SegmentedCopy: write after end");
    if (tuples.length === 0) return;
    this.queue.push({ tuples, mark });
    this.queued += tuples.length;
    this.wakePump?.();
    while (this.queued > this.options.maxQueuedBytes && !this.stopped()) await new Promise<void>((resolve) => (this.wakeProducer = resolve));
    const stopped = this.stopped();
    if (stopped) throw stopped.error;
  }

  /** Sends what is queued, flushes the last segment and resolves when all of it is done. */
  async end(): Promise<void> {
    this.ended = true;
    this.wakePump?.();
    await this.pumping;
    const stopped = this.stopped();
    if (stopped) throw stopped.error;
  }

  /** Stops after a failure elsewhere: an open COPY is cancelled (CopyFail), a running flush is waited for. */
  async abort(reason: Error): Promise<void> {
    this.failure ??= { error: reason };
    this.ended = true;
    this.queue.length = 0;
    this.queued = 0;
    this.open?.destroy(reason);
    this.wakePump?.();
    await this.pumping;
  }

  /** What stopped the copy, if anything (a method, so that checks after an await are not narrowed away). */
  private stopped(): { error: unknown } | null {
    return this.failure;
  }

  private async next(): Promise<{ tuples: Buffer; mark: number } | null> {
    while (this.queue.length === 0) {
      if (this.ended) return null;
      await new Promise<void>((resolve) => (this.wakePump = resolve));
      this.wakePump = null;
    }
    if (this.stopped()) return null;
    const item = this.queue.shift()!;
    this.queued -= item.tuples.length;
    if (this.queued <= this.options.maxQueuedBytes) this.wakeProducer?.();
    return item;
  }

  private async pump(): Promise<void> {
    let sent = 0;
    let after = 0;
    let item = await this.next();
    while (item && !this.stopped()) {
      const copy = this.client.query(copyFrom(this.options.copySql));
      this.open = copy;
      const done = finished(copy);
      // Rejects once the COPY fails (PostgreSQL refused a tuple, the connection broke): a wait for "drain" on a
      // failed stream would never end.
      const failed = done.then(() => Promise.reject(new Error("the COPY ended before its trailer")));
      failed.catch(() => undefined);
      copy.write(this.options.header);
      const limit = this.options.segmentBytes(sent);
      let bytes = 0;
      let upTo = after;
      for (;;) {
        if (copy.destroyed) await failed;
        if (!copy.write(item.tuples)) await Promise.race([once(copy, "drain"), failed]);
        bytes += item.tuples.length;
        upTo = item.mark;
        if (bytes >= limit) break; // the segment is full: flush it now, not when the next tuples come
        item = await this.next();
        if (!item) break;
      }
      const stopped = this.stopped();
      if (stopped) {
        copy.destroy(stopped.error instanceof Error ? stopped.error : new Error(String(stopped.error)));
        await done.catch(() => undefined);
        return;
      }
      if (copy.destroyed) await failed;
      copy.end(this.options.trailer);
      await done;
      this.open = null;
      sent += bytes;
      await this.options.flush(after, upTo);
      after = upTo;
      this.segments++;
      item = await this.next();
    }
  }
}
