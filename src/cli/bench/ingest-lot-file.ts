// Writes an invented probe lot file (§4) of any size with streamed writes, for the ingest benchmark.
import { createWriteStream } from "node:fs";
import { once } from "node:events";

export interface LotShape {
  lot: string;
  product: string;
  wafers: number;
  diesPerWafer: number;
  pointsPerDie: number;
}

export interface WrittenLot {
  path: string;
  bytes: number;
  rows: number;
  dies: number;
  /** 1-based line of the first data row (after the metadata and the header). */
  firstDataLine: number;
}

const SWEEP_HALF_SPAN_MV = 10; // ±10 mV: inside the ±12.9 mV thermal window at 300 K with w = 0.5 (§5)
const CHUNK_CHARACTERS = 1 << 20;

/** A deterministic value in [0, 1) from two integers (the usual fract(sin(·)·43758.5453) hash; common practice). */
function hash01(a: number, b: number): number {
  const s = Math.sin(a * 12.9898 + b * 78.233) * 43758.5453;
  return s - Math.floor(s);
}

/** Grid width that lays `dies` out about twice as wide as tall (5,000 → 100 × 50, 20,000 → 200 × 100). */
export function gridWidth(dies: number): number {
  return Math.ceil(Math.sqrt(2 * dies));
}

function biasesMv(points: number): string[] {
  return Array.from({ length: points }, (_, k) => {
    const v = points === 1 ? 0 : -SWEEP_HALF_SPAN_MV + (2 * SWEEP_HALF_SPAN_MV * k) / (points - 1);
    return v.toFixed(3); // fixed decimals, as stations print them
  });
}

/**
 * A die's conductance in µS, from hashes of (wafer, die): 96 % around 1.45 µS with a 2 % spread (a sum of three
 * uniforms, near normal), 2 % drifted low to 1.1–1.3 µS (inside the spec but outside the wafer's PAT window),
 * 1 % above the 1.65 µS spec (HIGH) and 1 % open (1 pS, OPEN under a 1 nS threshold). Invented, for the benchmark.
 */
function conductanceUs(wafer: number, die: number): number {
  const kind = hash01(wafer, die);
  const u = hash01(die, wafer + 101);
  if (kind < 0.01) return 1e-6;
  if (kind < 0.02) return 1.7 + 0.2 * u;
  if (kind < 0.04) return 1.1 + 0.2 * u;
  const z = (u + hash01(die + 7, wafer) + hash01(wafer + 13, die + 3) - 1.5) * 2; // mean 0, σ = 1
  return 1.45 * (1 + 0.02 * z);
}

/** The rows of one die: I = G·V plus a ±5 pA ripple. µS × mV = nA, the file's current unit. */
function dieRows(wafer: number, die: number, width: number, biases: readonly string[], row: { n: number }): string {
  const x = die % width;
  const y = Math.floor(die / width);
  const g = conductanceUs(wafer, die);
  const prefix = `${wafer},${x},${y},`;
  let text = "";
  for (const bias of biases) {
    row.n++;
    const currentNa = g * Number(bias) + 0.005 * Math.sin(1.7 * row.n);
    text += `${prefix}${bias},${currentNa.toFixed(4)}\n`;
  }
  return text;
}

function head(shape: LotShape): string[] {
  return [
    `# lot: ${shape.lot}`,
    `# product: ${shape.product}`,
    "# chuck_temperature_k: 300.15",
    "# station: BENCH-01",
    "# measured_at: 2026-12-01T00:00:00Z",
    "wafer,die_x,die_y,bias_mv,current_na",
  ];
}

/** Mean bytes per data row of a shape, from its first dies (to size a file before writing it). */
export function estimateRowBytes(shape: Pick<LotShape, "pointsPerDie">, sampleDies = 2000, diesPerWafer = 300_000): number {
  const biases = biasesMv(shape.pointsPerDie);
  const width = gridWidth(diesPerWafer);
  let bytes = 0;
  const row = { n: 0 };
  for (let die = 0; die < sampleDies; die++) bytes += Buffer.byteLength(dieRows(13, die * 97, width, biases, row));
  return bytes / row.n;
}

/** Writes the lot wafer by wafer, die by die, in ~1 MiB chunks, waiting for the stream to drain. */
export async function writeLotFile(path: string, shape: LotShape): Promise<WrittenLot> {
  const out = createWriteStream(path);
  const biases = biasesMv(shape.pointsPerDie);
  const width = gridWidth(shape.diesPerWafer);
  const row = { n: 0 };
  let bytes = 0;
  const headLines = head(shape);
  let chunk = `${headLines.join("\n")}\n`;
  const flush = async () => {
    bytes += Buffer.byteLength(chunk);
    if (!out.write(chunk)) await once(out, "drain");
    chunk = "";
  };
  for (let wafer = 1; wafer <= shape.wafers; wafer++) {
    for (let die = 0; die < shape.diesPerWafer; die++) {
      chunk += dieRows(wafer, die, width, biases, row);
      if (chunk.length >= CHUNK_CHARACTERS) await flush();
    }
  }
  await flush();
  out.end();
  await once(out, "close");
  return { path, bytes, rows: row.n, dies: shape.wafers * shape.diesPerWafer, firstDataLine: headLines.length + 1 };
}
