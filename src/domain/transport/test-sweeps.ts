import type { IvPoint } from "./linear-response";

// Shared by the transport tests only.

export const relErr = (x: number, ref: number) => Math.abs(x - ref) / Math.abs(ref);

/** Deterministic uniform [0, 1) generator (mulberry32) so random comparisons are reproducible. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** IV points without compliance from a list of biases and a current function. */
export function sweep(biasesV: readonly number[], currentA: (biasV: number) => number): IvPoint[] {
  return biasesV.map((biasV) => ({ biasV, currentA: currentA(biasV), compliance: false }));
}

/** Evenly spaced values from `from` to `to` inclusive, computed from integer steps. */
export function range(from: number, to: number, stepSize: number): number[] {
  return Array.from({ length: Math.round((to - from) / stepSize) + 1 }, (_, i) => from + i * stepSize);
}
