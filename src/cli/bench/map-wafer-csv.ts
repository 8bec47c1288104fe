// Synthetic one-wafer probe files for `npm run bench:map`: N dies filling a round wafer, 5 points per die.

export interface BenchDie {
  x: number;
  y: number;
}

export interface BenchWafer {
  dies: BenchDie[];
  /** Midpoint of the probed extents in grid units, as the map lays the wafer out (yield/geometry gridCentre). */
  centre: { x: number; y: number };
}

// Biases well inside the thermal window (±12.93 mV at 300 K with w = 0.5, §5), so all 5 points are in window.
export const BENCH_BIASES_MV = [-8, -4, 0, 4, 8] as const;
const BASE_CONDUCTANCE_US = 1.4;

/**
 * Square die side in mm that fills the usable disc of a wafer with about `dieCount` dies:
 * side = √(π·(D/2 − edge)² / N), rounded down to 0.1 mm so the N dies stay inside. RangeError unless N ≥ 1.
 */
export function benchDieSideMm(dieCount: number, waferDiameterMm: number, edgeExclusionMm: number): number {
  if (!Number.isInteger(dieCount) || dieCount < 1) throw new RangeError(`dieCount must be a positive integer, got ${dieCount}`);
  const usableRadiusMm = waferDiameterMm / 2 - edgeExclusionMm;
  return Math.floor(Math.sqrt((Math.PI * usableRadiusMm ** 2) / dieCount) * 10) / 10;
}

/**
 * The `dieCount` grid positions nearest the centre of a (2k+1)² grid (k large enough to hold them), by distance
 * then y then x, so the wafer is round and the result deterministic. Indices are non-negative.
 */
export function benchWafer(dieCount: number): BenchWafer {
  if (!Number.isInteger(dieCount) || dieCount < 1) throw new RangeError(`dieCount must be a positive integer, got ${dieCount}`);
  const k = Math.ceil(Math.sqrt(dieCount / Math.PI)) + 2;
  const all: { x: number; y: number; r2: number }[] = [];
  for (let y = -k; y <= k; y++) for (let x = -k; x <= k; x++) all.push({ x, y, r2: x * x + y * y });
  all.sort((a, b) => a.r2 - b.r2 || a.y - b.y || a.x - b.x);
  const dies = all.slice(0, dieCount).map(({ x, y }) => ({ x: x + k, y: y + k }));
  const xs = dies.map((d) => d.x);
  const ys = dies.map((d) => d.y);
  return { dies, centre: { x: (Math.min(...xs) + Math.max(...xs)) / 2, y: (Math.min(...ys) + Math.max(...ys)) / 2 } };
}

/** Deterministic 32-bit LCG in [0, 1) (Numerical Recipes constants 1664525, 1013904223). */
function lcg(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

/**
 * The §4 CSV of one lot with one wafer: metadata lines, then `wafer,die_x,die_y,bias_mv,current_na` rows, I = G·V
 * (µS × mV = nA) with G = 1.4 µS × (1 + 0.12·ρ²) × (1 ± 4 % noise), ρ the die's radius over the wafer's
 * largest, so the map has a radial gradient and a few LOW/HIGH dies against a 1.0–1.65 µS spec.
 */
export function benchLotCsv(lot: string, product: string, wafer: BenchWafer, seed = 1): string {
  const random = lcg(seed);
  const { centre } = wafer;
  const maxR2 = Math.max(1, ...wafer.dies.map((d) => (d.x - centre.x) ** 2 + (d.y - centre.y) ** 2));
  const lines = [
    `# lot: ${lot}`,
    `# product: ${product}`,
    "# chuck_temperature_k: 300.15",
    "# station: BENCH-01",
    "# measured_at: 2026-12-01T08:00:00Z",
    "wafer,die_x,die_y,bias_mv,current_na",
  ];
  for (const die of wafer.dies) {
    const rho2 = ((die.x - centre.x) ** 2 + (die.y - centre.y) ** 2) / maxR2;
    const conductanceUs = BASE_CONDUCTANCE_US * (1 + 0.12 * rho2) * (1 + 0.08 * (random() - 0.5));
    for (const biasMv of BENCH_BIASES_MV) {
      const currentNa = conductanceUs * biasMv + 0.002 * (random() - 0.5);
      lines.push(`1,${die.x},${die.y},${biasMv},${currentNa.toFixed(5)}`);
    }
  }
  return lines.join("\n") + "\n";
}
