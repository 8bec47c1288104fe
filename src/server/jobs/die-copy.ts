import "server-only";
import type { DieResult } from "@/domain/transport";
import { SWEEP_BYTES_PER_POINT, type SweepArrays, writeSweep } from "./sweep-codec";

// Rows for COPY … FROM STDIN in PostgreSQL's binary format (PostgreSQL documentation, "COPY", section "Binary
// Format"): an 11-byte signature, a flags word and a header-extension length, then per tuple an int16 field count
// and per field an int32 byte length (−1 for NULL) followed by the value in the type's binary send format
// (integers and float8 big-endian, boolean one byte, text as UTF-8, bytea as is), and an int16 −1 trailer.
// Binary rather than text: the text format spent about a third of the job's app CPU formatting numbers and
// hex-encoding each die's sweep (≈ 700 characters a die) and as much again in PostgreSQL parsing them back.
export const TMP_DIE_COLUMNS = [
  "wafer_slot", "x", "y", "conductance_s", "offset_a", "r2", "points_in_window", "window_v", "nonlinearity",
  "nonlinearity_window_only", "modes", "bin", "reason", "temperature_k", "site", "points", "sweep", "first_line",
] as const;

export const CREATE_TMP_DIES = `create temp table tmp_dies (
  wafer_slot integer, x integer, y integer, conductance_s float8, offset_a float8, r2 float8, points_in_window integer,
  window_v float8, nonlinearity float8, nonlinearity_window_only boolean, modes float8, bin text, reason text,
  temperature_k float8, site text, points integer, sweep bytea, first_line integer) on commit drop`;

/**
 * The job moves tmp_dies into dies segment by segment, each one a range of first lines (ingest-lot.ts): dies come
 * from the reader in file order, so each segment's first lines follow the last one's.
 */
export const INDEX_TMP_DIES = "create index tmp_dies_first_line on tmp_dies (first_line)";

/** The COPY statement the encoder's tuples are for, between COPY_HEADER and COPY_TRAILER. */
export const COPY_TMP_DIES = `copy tmp_dies (${TMP_DIE_COLUMNS.join(", ")}) from stdin with (format binary)`;

/** Binary COPY's file header: the 11-byte signature, a flags word (no OIDs) and a zero header-extension length. */
export const COPY_HEADER = Buffer.concat([Buffer.from("PGCOPY\n\xff\r\n\0", "latin1"), Buffer.alloc(8)]);
/** Binary COPY's end marker: a field count of −1. */
export const COPY_TRAILER = Buffer.from([0xff, 0xff]);

const FIELDS = TMP_DIE_COLUMNS.length;

/**
 * Encodes tmp_dies tuples into COPY binary bytes, in batches: `die` appends one tuple, `take` hands over what has
 * been written. Tuples only: a COPY sends COPY_HEADER before them and COPY_TRAILER after. One growing buffer, no
 * allocation per field.
 */
export class DieCopyEncoder {
  private buffer = Buffer.allocUnsafe(256 * 1024);
  private at = 0;

  /** Bytes written and not yet taken. */
  get size(): number {
    return this.at;
  }

  /** One die: its identity, its §5 result and its sweep (written as sweep-codec's bytes, straight into the batch). */
  die(wafer: number, x: number, y: number, r: DieResult, site: string | null, sweep: SweepArrays, firstLine: number): void {
    const sweepBytes = sweep.length * SWEEP_BYTES_PER_POINT;
    this.ensure(2 + FIELDS * 12 + 256 + sweepBytes + (r.reason?.length ?? 0) * 3 + (site?.length ?? 0) * 3);
    this.at = this.buffer.writeInt16BE(FIELDS, this.at);
    this.int4(wafer);
    this.int4(x);
    this.int4(y);
    this.float8(r.conductanceS);
    this.float8(r.offsetA);
    this.float8(r.r2);
    this.int4(r.pointsInWindow);
    this.float8(r.windowV);
    this.float8(r.nonlinearity);
    this.at = this.buffer.writeInt32BE(1, this.at);
    this.at = this.buffer.writeUInt8(r.nonlinearityWindowOnly ? 1 : 0, this.at);
    this.float8(r.modes);
    this.text(r.bin);
    this.text(r.reason);
    this.float8(r.temperatureK);
    this.text(site);
    this.int4(sweep.length);
    this.at = this.buffer.writeInt32BE(sweepBytes, this.at);
    this.at = writeSweep(this.buffer, this.at, sweep.biasV, sweep.currentA, sweep.compliance, sweep.length);
    this.int4(firstLine);
  }

  /** Everything written since the last take, as a new Buffer (the encoder reuses its own). */
  take(): Buffer {
    const out = Buffer.from(this.buffer.subarray(0, this.at));
    this.at = 0;
    return out;
  }

  private ensure(bytes: number): void {
    if (this.at + bytes <= this.buffer.length) return;
    const next = Buffer.allocUnsafe(Math.max(this.buffer.length * 2, this.at + bytes));
    this.buffer.copy(next, 0, 0, this.at);
    this.buffer = next;
  }

  private int4(value: number): void {
    this.at = this.buffer.writeInt32BE(4, this.at);
    this.at = this.buffer.writeInt32BE(value, this.at);
  }

  private float8(value: number | null): void {
    // NaN and ±∞ are stored as NULL, as the text format did ("no value"), never as float8 specials.
    if (value === null || !Number.isFinite(value)) {
      this.at = this.buffer.writeInt32BE(-1, this.at);
      return;
    }
    this.at = this.buffer.writeInt32BE(8, this.at);
    this.at = this.buffer.writeDoubleBE(value, this.at);
  }

  private text(value: string | null): void {
    if (value === null) {
      this.at = this.buffer.writeInt32BE(-1, this.at);
      return;
    }
    const lengthAt = this.at;
    const written = this.buffer.write(value, lengthAt + 4, "utf8");
    this.buffer.writeInt32BE(written, lengthAt);
    this.at = lengthAt + 4 + written;
  }
}
