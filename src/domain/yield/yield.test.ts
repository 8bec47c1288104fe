import { describe, expect, it } from "vitest";
import { binCounts, binPareto, medianOf, waferYield, type Bin } from "./yield";

function repeat(bin: Bin, n: number): Bin[] {
  return Array.from({ length: n }, () => bin);
}

describe("waferYield", () => {
  it("divides PASS by every tested die, NODATA included", () => {
    // 6 PASS of 10 dies (2 NODATA, 1 LOW, 1 SHORT) → 0.6
    const bins: Bin[] = [...repeat("PASS", 6), "NODATA", "NODATA", "LOW", "SHORT"];
    expect(waferYield(bins)).toEqual({ tested: 10, pass: 6, yield: 0.6, shippedPass: 6, shippedYield: 0.6 });
  });

  it("counts inked PASS dies as fails in the shipped yield only", () => {
    // 4 PASS of 5; two PASS dies inked, and an inked LOW die changes nothing → shipped 2/5
    const bins: Bin[] = ["PASS", "PASS", "PASS", "PASS", "LOW"];
    const inked = [true, false, true, false, true];
    expect(waferYield(bins, inked)).toEqual({ tested: 5, pass: 4, yield: 0.8, shippedPass: 2, shippedYield: 0.4 });
  });

  it("gives null yields for a wafer with no dies", () => {
    expect(waferYield([])).toEqual({ tested: 0, pass: 0, yield: null, shippedPass: 0, shippedYield: null });
  });

  it("refuses an ink list that does not match the dies", () => {
    expect(() => waferYield(["PASS", "PASS"], [true])).toThrow(RangeError);
  });
});

describe("binCounts", () => {
  it("counts each bin and reports absent bins as zero", () => {
    expect(binCounts(["PASS", "LOW", "PASS", "NODATA"])).toEqual({
      NODATA: 1,
      SHORT: 0,
      OPEN: 0,
      NONLINEAR: 0,
      LOW: 1,
      HIGH: 0,
      PASS: 2,
    });
  });
});

describe("binPareto", () => {
  it("sorts failing bins by count with their share of fails and the running total", () => {
    // Fails: LOW 5, SHORT 3, HIGH 2 → 10 fails; 50 %, 30 %, 20 %; cumulative 50, 80, 100.
    const bins: Bin[] = [...repeat("PASS", 20), ...repeat("HIGH", 2), ...repeat("LOW", 5), ...repeat("SHORT", 3)];
    const pareto = binPareto(bins);
    expect(pareto.map((e) => [e.bin, e.count])).toEqual([
      ["LOW", 5],
      ["SHORT", 3],
      ["HIGH", 2],
    ]);
    expect(pareto.map((e) => e.percentOfFails)).toEqual([50, 30, 20]);
    expect(pareto.map((e) => e.cumulativePercent)).toEqual([50, 80, 100]);
  });

  it("breaks ties in bin order and ends at 100 % for thirds", () => {
    const pareto = binPareto(["OPEN", "NODATA", "HIGH"]);
    expect(pareto.map((e) => e.bin)).toEqual(["NODATA", "OPEN", "HIGH"]);
    expect(pareto[0]?.percentOfFails).toBeCloseTo(100 / 3, 12);
    expect(pareto[2]?.cumulativePercent).toBeCloseTo(100, 12);
  });

  it("is empty when every die passed or none were tested", () => {
    expect(binPareto(["PASS", "PASS"])).toEqual([]);
    expect(binPareto([])).toEqual([]);
  });
});

describe("medianOf", () => {
  it("takes the middle value of an odd count regardless of order", () => {
    expect(medianOf([5e-6, 1e-6, 3e-6])).toBe(3e-6);
  });

  it("averages the two middle values of an even count", () => {
    expect(medianOf([4, 1, 3, 2])).toBe(2.5);
  });

  it("skips non-finite values and gives null when none remain", () => {
    expect(medianOf([Number.NaN, 7, Number.POSITIVE_INFINITY, 1])).toBe(4);
    expect(medianOf([Number.NaN])).toBeNull();
    expect(medianOf([])).toBeNull();
  });

  it("does not reorder the caller's array", () => {
    const values = [3, 1, 2];
    medianOf(values);
    expect(values).toEqual([3, 1, 2]);
  });
});
