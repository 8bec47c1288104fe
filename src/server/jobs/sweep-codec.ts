// The compact per-die sweep kept with each die: little-endian float64 triples (bias V, current A, compliance 0/1).
// Plain code, no server imports, so the API and the tests share it.

export function encodeSweep(bias: Float64Array, current: Float64Array, compliance: Uint8Array, length: number): Buffer {
  const out = Buffer.allocUnsafe(length * 24);
  for (let i = 0; i < length; i++) {
    out.writeDoubleLE(bias[i]!, i * 24);
    out.writeDoubleLE(current[i]!, i * 24 + 8);
    out.writeDoubleLE(compliance[i]!, i * 24 + 16);
  }
  return out;
}

export interface DecodedSweep {
  biasV: Float64Array;
  currentA: Float64Array;
  compliance: Uint8Array;
  length: number;
}

export function decodeSweep(bytes: Buffer): DecodedSweep {
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
export function concatSweeps(parts: DecodedSweep[]): DecodedSweep {
  const length = parts.reduce((n, p) => n + p.length, 0);
  const out: DecodedSweep = { biasV: new Float64Array(length), currentA: new Float64Array(length), compliance: new Uint8Array(length), length };
  let at = 0;
  for (const p of parts) {
    out.biasV.set(p.biasV.subarray(0, p.length), at);
    out.currentA.set(p.currentA.subarray(0, p.length), at);
    out.compliance.set(p.compliance.subarray(0, p.length), at);
    at += p.length;
  }
  return out;
}
