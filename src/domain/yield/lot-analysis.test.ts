import { describe, expect, it } from "vitest";
import { waferGeometry } from "./geometry";
import { countDiesInside } from "./gross-dies";
import { grossDieCheck, histogramCounts, parseBin, sharedBinEdges, spreadOf, waferDistributions, zoneTable } from "./lot-analysis";
import type { Bin } from "./yield";

describe("parseBin", () => {
  it("accepts the §5 bins and refuses anything else", () => {
    expect(parseBin("PASS")).toBe("PASS");
    expect(parseBin("NONLINEAR")).toBe("NONLINEAR");
    expect(parseBin("pass")).toBeNull();
    expect(parseBin("INKED")).toBeNull();
  });
});

describe("spreadOf", () => {
  it("gives type-7 quartiles (R's default: quantile(1:4) = 1.75, 2.5, 3.25)", () => {
    const s = spreadOf([4, 1, 3, 2]);
    expect(s.n).toBe(4);
    expect(s.q1).toBeCloseTo(1.75, 12);
    expect(s.median).toBeCloseTo(2.5, 12);
    expect(s.q3).toBeCloseTo(3.25, 12);
    expect(s.iqr).toBeCloseTo(1.5, 12);
  });

  it("lands on order statistics for 1…9 (h = 8p is whole at p = ¼, ½, ¾)", () => {
    expect(spreadOf([1, 2, 3, 4, 5, 6, 7, 8, 9])).toEqual({ n: 9, q1: 3, median: 5, q3: 7, iqr: 4 });
  });

  it("skips non-finite values and reports nulls when none remain", () => {
    expect(spreadOf([Number.NaN, 2, Number.POSITIVE_INFINITY]).median).toBe(2);
    expect(spreadOf([Number.NaN])).toEqual({ n: 0, q1: null, median: null, q3: null, iqr: null });
    expect(spreadOf([])).toEqual({ n: 0, q1: null, median: null, q3: null, iqr: null });
  });
});

describe("sharedBinEdges", () => {
  // n = 8, type-7 Q₁ = 1.75, Q₃ = 5.25, IQR = 3.5: far fences clip the range to [0, 15.75]; Freedman–Diaconis
  // width 2·3.5/∛8 = 3.5 → ⌈15.75/3.5⌉ = 5 bins of 3.15, rounded up to a width of 5 → edges 0, 5, 10, 15, 20.
  const skewed = [0, 1, 2, 3, 4, 5, 6, 100];

  it("bins the range inside Tukey's far fences by the Freedman–Diaconis rule, on round edges", () => {
    expect(sharedBinEdges(skewed)).toEqual([0, 5, 10, 15, 20]);
  });

  it("caps the bin count at maxBins before rounding the width", () => {
    // 2 bins of 7.875 → width 10.
    expect(sharedBinEdges(skewed, 2)).toEqual([0, 10, 20]);
  });

  it("falls back to Sturges' ⌈log₂ n⌉ + 1 bins when the IQR is zero", () => {
    // n = 8 → 4 bins over 5…9, width 1.
    expect(sharedBinEdges([5, 5, 5, 5, 5, 5, 5, 9])).toEqual([5, 6, 7, 8, 9]);
  });

  it("covers every value of a sample without far outliers, with edges on multiples of the width", () => {
    const values = Array.from({ length: 200 }, (_, i) => 1.2e-6 + 0.4e-6 * Math.sin(i));
    const edges = sharedBinEdges(values);
    expect(edges[0]!).toBeLessThanOrEqual(Math.min(...values));
    expect(edges.at(-1)!).toBeGreaterThanOrEqual(Math.max(...values));
    const width = edges[1]! - edges[0]!;
    const mantissa = width / 10 ** Math.floor(Math.log10(width));
    expect([1, 2, 2.5, 5].some((m) => Math.abs(mantissa - m) < 1e-9)).toBe(true);
    expect(edges.length - 1).toBeLessThanOrEqual(60);
  });

  it("gives one narrow bin round a constant sample and none for no finite value", () => {
    expect(sharedBinEdges([2, 2, 2])).toEqual([1.99, 2.01]);
    expect(sharedBinEdges([0, 0])).toEqual([-0.5, 0.5]);
    expect(sharedBinEdges([Number.NaN])).toEqual([]);
  });
});

describe("histogramCounts", () => {
  const edges = [0, 1, 2, 3];

  it("puts a value on an inner edge in the upper bin and one on the last edge in the last bin", () => {
    expect(histogramCounts([0, 0.5, 1, 2.5, 3], edges)).toEqual([2, 1, 2]);
  });

  it("leaves out values beyond the edges and non-finite values", () => {
    expect(histogramCounts([-0.1, 3.1, Number.NaN, 1.5], edges)).toEqual([0, 1, 0]);
  });

  it("has no bins without two edges", () => {
    expect(histogramCounts([1], [1])).toEqual([]);
  });
});

describe("waferDistributions", () => {
  it("bins every wafer on edges shared over the pooled values, so each wafer's counts add up to its finite values", () => {
    const result = waferDistributions([
      { wafer: 1, values: [1, 2, 3, Number.NaN] },
      { wafer: 2, values: [10, 11, 12, 13] },
    ]);
    expect(result.edges).toEqual(sharedBinEdges([1, 2, 3, 10, 11, 12, 13]));
    expect(result.wafers.map((w) => w.counts.reduce((a, b) => a + b, 0))).toEqual([3, 4]);
    expect(result.wafers.map((w) => w.below + w.above)).toEqual([0, 0]);
    expect(result.wafers[1]!.spread.median).toBeCloseTo(11.5, 12);
  });

  it("counts a wafer's far outliers beside the histogram but keeps them in its quartiles", () => {
    const result = waferDistributions([{ wafer: 1, values: [0, 1, 2, 3] }, { wafer: 2, values: [4, 5, 6, 100] }]);
    expect(result.edges.at(-1)).toBe(20);
    expect(result.wafers[1]!.above).toBe(1);
    expect(result.wafers[1]!.counts.reduce((a, b) => a + b, 0)).toBe(3);
    expect(result.wafers[1]!.spread.n).toBe(4);
  });

  it("returns no edges and empty counts when no wafer has a value", () => {
    const result = waferDistributions([{ wafer: 3, values: [] }]);
    expect(result.edges).toEqual([]);
    expect(result.wafers[0]!.counts).toEqual([]);
    expect(result.wafers[0]!.spread.n).toBe(0);
  });
});

describe("zoneTable", () => {
  const pass = (zone: "centre" | "edge", n: number) => Array.from({ length: n }, () => ({ zone, bin: "PASS" as Bin }));
  const fail = (zone: "centre" | "edge", n: number) => Array.from({ length: n }, () => ({ zone, bin: "OPEN" as Bin }));

  it("pools the lot row over dies, not over wafer yields, and states the centre − edge gap", () => {
    // Wafer 1: centre 1/2, edge 0/2. Wafer 2: centre 3/3, edge 2/2. Lot centre 4/5 = 0.8 (the mean of wafer yields would be 0.75).
    const table = zoneTable([
      { wafer: 1, dies: [...pass("centre", 1), ...fail("centre", 1), ...fail("edge", 2)] },
      { wafer: 2, dies: [...pass("centre", 3), ...pass("edge", 2)] },
    ]);
    expect(table.wafers[0]!.edgeVersusCentre.gap).toBeCloseTo(0.5, 12);
    expect(table.wafers[1]!.edgeVersusCentre.gap).toBeCloseTo(0, 12);
    expect(table.lot.wafer).toBeNull();
    expect(table.lot.zones.centre).toEqual({ tested: 5, pass: 4, yield: 0.8 });
    expect(table.lot.zones.edge).toEqual({ tested: 4, pass: 2, yield: 0.5 });
    expect(table.lot.edgeVersusCentre.gap).toBeCloseTo(0.3, 12);
    expect(table.lot.zones.middle.yield).toBeNull();
  });
});

describe("grossDieCheck", () => {
  it("matches the textbook estimate of about 270 dies of 1.5 cm × 1.5 cm on a 300 mm wafer (from memory)", () => {
    const check = grossDieCheck(waferGeometry({ dieWidthMm: 15, dieHeightMm: 15, waferDiameterMm: 300, edgeExclusionMm: 0 }));
    expect(check.estimateWhole).toBeCloseTo(270, -0.5);
    expect(check.estimateUsable).toBe(check.estimateWhole);
  });

  it("applies the formula to the usable diameter d − 2·edge exclusion and counts dies inside that circle", () => {
    const g = waferGeometry({ dieWidthMm: 2, dieHeightMm: 2, waferDiameterMm: 150, edgeExclusionMm: 3 });
    const check = grossDieCheck(g);
    const closedForm = (d: number) => (Math.PI * d * d) / (4 * 4) - (Math.PI * d) / Math.sqrt(8);
    expect(check.estimateUsable).toBeCloseTo(closedForm(144), 9);
    expect(check.estimateWhole).toBeCloseTo(closedForm(150), 9);
    expect(check.exactInside).toBe(countDiesInside(g));
    // The formula's edge term is meant to approximate the exact count to within a few per cent.
    expect(Math.abs(check.exactInside - check.estimateUsable) / check.exactInside).toBeLessThan(0.03);
  });
});
