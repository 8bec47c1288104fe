import { describe, expect, it } from "vitest";
import { c4, chartConstants, type ChartConstants } from "./constants";

type Column = Exclude<keyof ChartConstants, "n">;

// SPC constants: Montgomery, Introduction to Statistical Quality Control, Appendix VI, n = 2…10, as
// printed (A₂, A₃, B₃, B₄, d₂, d₃, D₃, D₄ to 3 decimals, c₄ to 4) — values from memory.
const TABLE: Record<number, Record<Column, number>> = {
  2: { A2: 1.88, A3: 2.659, c4: 0.7979, B3: 0, B4: 3.267, d2: 1.128, d3: 0.853, D3: 0, D4: 3.267 },
  3: { A2: 1.023, A3: 1.954, c4: 0.8862, B3: 0, B4: 2.568, d2: 1.693, d3: 0.888, D3: 0, D4: 2.574 },
  4: { A2: 0.729, A3: 1.628, c4: 0.9213, B3: 0, B4: 2.266, d2: 2.059, d3: 0.88, D3: 0, D4: 2.282 },
  5: { A2: 0.577, A3: 1.427, c4: 0.94, B3: 0, B4: 2.089, d2: 2.326, d3: 0.864, D3: 0, D4: 2.114 },
  6: { A2: 0.483, A3: 1.287, c4: 0.9515, B3: 0.03, B4: 1.97, d2: 2.534, d3: 0.848, D3: 0, D4: 2.004 },
  7: { A2: 0.419, A3: 1.182, c4: 0.9594, B3: 0.118, B4: 1.882, d2: 2.704, d3: 0.833, D3: 0.076, D4: 1.924 },
  8: { A2: 0.373, A3: 1.099, c4: 0.965, B3: 0.185, B4: 1.815, d2: 2.847, d3: 0.82, D3: 0.136, D4: 1.864 },
  9: { A2: 0.337, A3: 1.032, c4: 0.9693, B3: 0.239, B4: 1.761, d2: 2.97, d3: 0.808, D3: 0.184, D4: 1.816 },
  10: { A2: 0.308, A3: 0.975, c4: 0.9727, B3: 0.284, B4: 1.716, d2: 3.078, d3: 0.797, D3: 0.223, D4: 1.777 },
};

// Half a unit in the printed place, so the computed value must round to the printed one. The D
// column gets a full unit: the table formed D₄ from the already rounded d₂, d₃ (D₄(3) = 1 + 3·0.888/1.693
// = 2.574, where the exact value is 2.5746).
function tolerance(column: Column): number {
  if (column === "c4") return 0.5e-4;
  if (column === "D3" || column === "D4") return 1e-3;
  return 0.5e-3;
}

describe("chartConstants against the published table", () => {
  for (const [n, row] of Object.entries(TABLE)) {
    it(`rounds to the printed row for n = ${n}`, () => {
      const computed = chartConstants(Number(n));
      for (const [column, printed] of Object.entries(row) as [Column, number][]) {
        expect(Math.abs(computed[column] - printed), `${column}(${n})`).toBeLessThanOrEqual(tolerance(column) + 1e-12);
      }
    });
  }

  it("matches the larger subgroups of the ASTM E2587 table (from memory): c₄, d₂, d₃ at n = 15, 20, 25", () => {
    const rows: [number, number, number, number][] = [
      [15, 0.9823, 3.472, 0.756],
      [20, 0.9869, 3.735, 0.729],
      [25, 0.9896, 3.931, 0.708],
    ];
    for (const [n, c4Printed, d2Printed, d3Printed] of rows) {
      const computed = chartConstants(n);
      expect(Math.abs(computed.c4 - c4Printed)).toBeLessThanOrEqual(0.5e-4);
      expect(Math.abs(computed.d2 - d2Printed)).toBeLessThanOrEqual(0.5e-3);
      expect(Math.abs(computed.d3 - d3Printed)).toBeLessThanOrEqual(0.5e-3);
    }
  });
});

describe("chartConstants against closed forms", () => {
  it("gives d₂(2) = 2/√π, d₃(2) = √(2 − 4/π) and c₄(2) = √(2/π) for the range of two normals, to 1e-12", () => {
    const { d2, d3, c4: c4Two } = chartConstants(2);
    expect(d2).toBeCloseTo(2 / Math.sqrt(Math.PI), 12);
    expect(d3).toBeCloseTo(Math.sqrt(2 - 4 / Math.PI), 12);
    expect(c4Two).toBeCloseTo(Math.sqrt(2 / Math.PI), 12);
  });

  it("gives d₂(3) = 3/√π and c₄(3) = √π/2, to 1e-12", () => {
    expect(chartConstants(3).d2).toBeCloseTo(3 / Math.sqrt(Math.PI), 12);
    expect(chartConstants(3).c4).toBeCloseTo(Math.sqrt(Math.PI) / 2, 12);
  });

  it("derives the chart factors from c₄, d₂, d₃ by their defining formulas", () => {
    const k = chartConstants(7);
    expect(k.A2).toBeCloseTo(3 / (k.d2 * Math.sqrt(7)), 14);
    expect(k.A3).toBeCloseTo(3 / (k.c4 * Math.sqrt(7)), 14);
    expect(k.B3 + k.B4).toBeCloseTo(2, 14);
    expect(k.D3 + k.D4).toBeCloseTo(2, 14);
    expect(k.D4 - 1).toBeCloseTo((3 * k.d3) / k.d2, 14);
  });

  it("floors B₃ and D₃ at zero where 1 − 3·spread would go negative (n = 5)", () => {
    const k = chartConstants(5);
    expect(k.B3).toBe(0);
    expect(k.D3).toBe(0);
    expect(k.B4).toBeGreaterThan(2);
  });

  it("follows the asymptotic series c₄ ≈ 1 − 1/(4n) − 7/(32n²) − 19/(128n³) for large n (from memory; 1e-9 at n = 200)", () => {
    const series = (n: number) => 1 - 1 / (4 * n) - 7 / (32 * n * n) - 19 / (128 * n ** 3);
    expect(Math.abs(c4(200) - series(200))).toBeLessThan(1e-9);
    // At n = 5000 the two ln Γ values are ≈ 1.7e4, so their difference carries ≈ 1e-12 of rounding.
    expect(Math.abs(c4(5000) - series(5000))).toBeLessThan(1e-10);
  });
});

describe("chartConstants input checks", () => {
  it("refuses subgroup sizes below 2 and fractional sizes", () => {
    expect(() => chartConstants(1)).toThrow(RangeError);
    expect(() => chartConstants(0)).toThrow(RangeError);
    expect(() => chartConstants(2.5)).toThrow(RangeError);
    expect(() => chartConstants(Number.NaN)).toThrow(RangeError);
    expect(() => c4(1)).toThrow(RangeError);
  });
});
