import type { DieFragment } from "./probe-file-types";

// Die fragments packed into a few flat typed arrays, so a batch crosses between threads as transferred buffers
// (no copy, no structured clone of thousands of small objects). Per fragment: six numbers (wafer, x, y, length,
// first line, last line: float64, so nothing out of int32 range wraps) and a float64 temperature (NaN for "none");
// then the points of all fragments end to end.
const META_FIELDS = 6;

export interface FragmentBatch {
  count: number;
  meta: Float64Array;
  temperatureK: Float64Array;
  biasV: Float64Array;
  currentA: Float64Array;
  compliance: Uint8Array;
  /** One entry per fragment, or null when no fragment of the batch has a site. */
  sites: (string | null)[] | null;
}

/**
 * Builds a batch as rows arrive: `point` appends one point of the fragment being read, `end` closes that fragment
 * with its identity, and `take` hands over the closed fragments as one batch, carrying the open fragment's points
 * over to the next. The arrays grow by doubling and are reused, so a die costs no allocation of its own.
 */
export class FragmentBatchWriter {
  private count = 0;
  private points = 0;
  private openFrom = 0; // where the open fragment's points start
  private meta = new Float64Array(META_FIELDS * 256);
  private temperatureK = new Float64Array(256);
  private biasV = new Float64Array(4096);
  private currentA = new Float64Array(4096);
  private compliance = new Uint8Array(4096);
  private sites: (string | null)[] = [];
  private anySite = false;

  /** Points of the open fragment so far. */
  get openLength(): number {
    return this.points - this.openFrom;
  }

  point(biasV: number, currentA: number, compliance: number): void {
    if (this.points === this.biasV.length) this.growPoints(this.points + 1);
    this.biasV[this.points] = biasV;
    this.currentA[this.points] = currentA;
    this.compliance[this.points] = compliance;
    this.points++;
  }

  /** Closes the open fragment (the points since the last `end`). */
  end(wafer: number, x: number, y: number, temperatureK: number | null, site: string | null, firstLine: number, lastLine: number): void {
    if (this.count === this.temperatureK.length) {
      this.meta = grown(this.meta, 2 * this.meta.length);
      this.temperatureK = grown(this.temperatureK, 2 * this.temperatureK.length);
    }
    const m = this.count * META_FIELDS;
    this.meta[m] = wafer;
    this.meta[m + 1] = x;
    this.meta[m + 2] = y;
    this.meta[m + 3] = this.points - this.openFrom;
    this.meta[m + 4] = firstLine;
    this.meta[m + 5] = lastLine;
    this.temperatureK[this.count] = temperatureK ?? Number.NaN;
    this.sites.push(site);
    this.anySite ||= site !== null;
    this.count++;
    this.openFrom = this.points;
  }

  /** The closed fragments so far, in fresh arrays the caller may transfer; the open fragment stays. */
  take(): FragmentBatch {
    const closed = this.openFrom;
    const batch: FragmentBatch = {
      count: this.count,
      meta: this.meta.slice(0, this.count * META_FIELDS),
      temperatureK: this.temperatureK.slice(0, this.count),
      biasV: this.biasV.slice(0, closed),
      currentA: this.currentA.slice(0, closed),
      compliance: this.compliance.slice(0, closed),
      sites: this.anySite ? this.sites : null,
    };
    this.biasV.copyWithin(0, closed, this.points);
    this.currentA.copyWithin(0, closed, this.points);
    this.compliance.copyWithin(0, closed, this.points);
    this.points -= closed;
    this.openFrom = 0;
    this.count = 0;
    this.sites = [];
    this.anySite = false;
    return batch;
  }

  private growPoints(needed: number): void {
    const size = Math.max(2 * this.biasV.length, needed);
    this.biasV = grown(this.biasV, size);
    this.currentA = grown(this.currentA, size);
    this.compliance = grown(this.compliance, size);
  }
}

/** The buffers a batch may hand over to another thread instead of copying. */
export function transferables(batch: FragmentBatch): ArrayBuffer[] {
  return [batch.meta, batch.temperatureK, batch.biasV, batch.currentA, batch.compliance].map((a) => a.buffer as ArrayBuffer);
}

/** The batch's fragments, in the order they were added; their point arrays are views of the batch's. */
export function unpackFragments(batch: FragmentBatch): DieFragment[] {
  const out: DieFragment[] = new Array(batch.count);
  let at = 0;
  for (let i = 0; i < batch.count; i++) {
    const m = i * META_FIELDS;
    const length = batch.meta[m + 3]!;
    const t = batch.temperatureK[i]!;
    out[i] = {
      wafer: batch.meta[m]!, x: batch.meta[m + 1]!, y: batch.meta[m + 2]!,
      biasV: batch.biasV.subarray(at, at + length), currentA: batch.currentA.subarray(at, at + length), compliance: batch.compliance.subarray(at, at + length),
      length, temperatureK: Number.isNaN(t) ? null : t, site: batch.sites?.[i] ?? null, firstLine: batch.meta[m + 4]!, lastLine: batch.meta[m + 5]!,
    };
    at += length;
  }
  return out;
}

function grown<T extends Float64Array | Uint8Array>(array: T, size: number): T {
  const next = new (array.constructor as new (n: number) => T)(size);
  next.set(array);
  return next;
}
