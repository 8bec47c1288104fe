import { describe, expect, it } from "vitest";
import { BENCH_BIASES_MV, benchDieSideMm, benchLotCsv, benchWafer } from "./map-wafer-csv";

describe("benchDieSideMm", () => {
  it("fills the usable disc: side = √(π·r²/N) rounded down to 0.1 mm", () => {
    // r = 97 mm: π·97² = 29 559 mm²; /20 000 → 1.2157 mm; /2 000 → 3.844 mm; /5 000 → 2.431 mm
    expect(benchDieSideMm(20_000, 200, 3)).toBe(1.2);
    expect(benchDieSideMm(2_000, 200, 3)).toBe(3.8);
    expect(benchDieSideMm(5_000, 200, 3)).toBe(2.4);
  });
  it("refuses a die count that is not a positive integer", () => {
    expect(() => benchDieSideMm(0, 200, 3)).toThrow(RangeError);
    expect(() => benchDieSideMm(1.5, 200, 3)).toThrow(RangeError);
  });
});

describe("benchWafer", () => {
  it("gives exactly N distinct non-negative dies", () => {
    const { dies } = benchWafer(2_000);
    expect(dies).toHaveLength(2_000);
    expect(new Set(dies.map((d) => `${d.x},${d.y}`)).size).toBe(2_000);
    expect(dies.every((d) => d.x >= 0 && d.y >= 0)).toBe(true);
  });
  it("keeps every die within the disc of area N (radius √(N/π) + 1 in grid units) round its centre", () => {
    const n = 5_000;
    const { dies, centre } = benchWafer(n);
    const maxR = Math.max(...dies.map((d) => Math.hypot(d.x - centre.x, d.y - centre.y)));
    expect(maxR).toBeLessThanOrEqual(Math.sqrt(n / Math.PI) + 1);
  });
  it("fits the 20 000-die wafer of 1.2 mm dies inside the 97 mm usable radius", () => {
    const { dies, centre } = benchWafer(20_000);
    const maxRMm = Math.max(...dies.map((d) => Math.hypot(d.x - centre.x, d.y - centre.y))) * 1.2;
    expect(maxRMm).toBeLessThan(97);
  });
});

describe("benchLotCsv", () => {
  it("writes the five metadata lines, the header and 5 rows per die with I = G·V in the 1.3–1.7 µS range", () => {
    const wafer = benchWafer(12);
    const lines = benchLotCsv("L1", "P1", wafer).trimEnd().split("\n");
    expect(lines.slice(0, 2)).toEqual(["# lot: L1", "# product: P1"]);
    expect(lines[5]).toBe("wafer,die_x,die_y,bias_mv,current_na");
    const rows = lines.slice(6).map((l) => l.split(",").map(Number));
    expect(rows).toHaveLength(12 * BENCH_BIASES_MV.length);
    for (const [, , , biasMv, currentNa] of rows) {
      if (biasMv === 0) continue;
      const conductanceUs = currentNa! / biasMv!; // µS × mV = nA
      expect(conductanceUs).toBeGreaterThan(1.3);
      expect(conductanceUs).toBeLessThan(1.7);
    }
  });
  it("is deterministic for a seed and differs between seeds", () => {
    const wafer = benchWafer(50);
    expect(benchLotCsv("L", "P", wafer, 3)).toBe(benchLotCsv("L", "P", wafer, 3));
    expect(benchLotCsv("L", "P", wafer, 3)).not.toBe(benchLotCsv("L", "P", wafer, 4));
  });
});
