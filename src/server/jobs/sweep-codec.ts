// The compact per-die sweep kept with each die: little-endian float64 triples (bias V, current A, compliance 0/1).
// Plain code, no server imports, so the API and the tests share it.

export const SWEEP_BYTES_PER_POINT = 24;

export function encodeSweep(bias: Float64Array, current: Float64Array, compliance: Uint8Array, length: number): Buffer {
  const out = Buffer.allocUnsafe(length * SWEEP_BYTES_PER_POINT);
  writeSweep(out, 0, bias, current, compliance, length);
  return out;
}

/** Writes the sweep's bytes into `out` at `at` (length × SWEEP_BYTES_PER_POINT of them); returns the offset after. */
export function writeSweep(out: Buffer, at: number, bias: Float64Array, current: Float64Array, compliance: Uint8Array, length: number): number {
  for (let i = 0; i < length; i++) {
    const p = at + i * SWEEP_BYTES_PER_POINT;
    out.writeDoubleLE(bias[i]!, p);
    out.writeDoubleLE(current[i]!, p + 8);
    out.writeDoubleLE(compliance[i]!, p + 16);
  }
  return at + length * SWEEP_BYTES_PER_POINT;
}

/** A die's points, as the probe-file reader and this codec hold them. */
export interface SweepArrays {
  biasV: Float64Array;
  currentA: Float64Array;
  compliance: Uint8Array;
  length: number;
}

export function decodeSweep(bytes: Buffer): SweepArrays {
  const length = Math.floor(bytes.length / 24);
  const biasV = new Float64Array(length);
  const currentA = new Float64Array(length);
  const compliance = new Uint8Array(length);
  for (let i = 0; i < length; i++) {
    biasV[i] = bytes.readDoubleLE(i * 24);
    currentA[i] = bytes.readDoubleLE(i * 24 + 8);
    compliance[i] = bytes.readDoubleLE(i * 24 + 16) ? 1 : 0;
  }
  return { biasV, currentA, compliance, length };
}

/** Joins the sweeps of a die that arrived in several runs of the file, in file order. */
export function concatSweeps(parts: SweepArrays[]): SweepArrays {
  const length = parts.reduce((n, p) => n + p.length, 0);
  const out: SweepArrays = { biasV: new Float64Array(length), currentA: new Float64Array(length), compliance: new Uint8Array(length), length };
  let at = 0;
  for (const p of parts) {
    out.biasV.set(p.biasV.subarray(0, p.length), at);
    out.currentA.set(p.currentA.subarray(0, p.length), at);
    out.compliance.set(p.compliance.subarray(0, p.length), at);
    at += p.length;
  }
  return out;
}
