// Synthetic probe files for the SPC tests: every die an exact I = G·V sweep inside the thermal window.
const BIASES_MV = [-10, -5, 0, 5, 10];

export interface SyntheticWafer {
  slot: number;
  /** G per die, in S, laid out row by row on a square grid. */
  diesS: number[];
}

/** A §4 probe file for one lot; `extra` metadata lines make otherwise equal files differ (a re-ingest). */
export function probeFile(lot: string, product: string, wafers: SyntheticWafer[], extra: Record<string, string> = {}): string {
  const lines = [`# lot: ${lot}`, `# product: ${product}`, "# chuck_temperature_k: 300", ...Object.entries(extra).map(([k, v]) => `# ${k}: ${v}`), "wafer,die_x,die_y,bias_mv,current_na"];
  for (const wafer of wafers) {
    const side = Math.ceil(Math.sqrt(wafer.diesS.length));
    wafer.diesS.forEach((g, i) => {
      const x = i % side;
      const y = Math.floor(i / side);
      for (const mv of BIASES_MV) lines.push(`${wafer.slot},${x},${y},${mv},${(g * mv * 1e-3 * 1e9).toPrecision(12)}`);
    });
  }
  return `${lines.join("\n")}\n`;
}

/** Nine dies around a wafer median m: m·(1 + 0.001·(k − 4)), k = 0…8, so the median is exactly m. */
export function ninesAround(medianS: number): number[] {
  return Array.from({ length: 9 }, (_, k) => medianS * (1 + 0.001 * (k - 4)));
}
