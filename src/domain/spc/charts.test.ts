import { mean as referenceMean, sampleStandardDeviation } from "simple-statistics";
import { describe, expect, it } from "vitest";
import { individualsChart, xbarSChart, xbarSChartFromStats, xbarSLimits, zoneBoundaries } from "./charts";
import { chartConstants } from "./constants";

// Closed forms used as references (normal order statistics): d₂(2) = 2/√π, D₄(2) = 1 + (3/2)√(2π − 4),
// c₄(2) = √(2/π), c₄(3) = √π/2, c₄(4) = 2√(2/3)/√π, c₄(5) = 3√(2π)/8.
const d2Of2 = 2 / Math.sqrt(Math.PI);
const d4Of2 = 1 + 1.5 * Math.sqrt(2 * Math.PI - 4);
const c4Of = { 2: Math.sqrt(2 / Math.PI), 3: Math.sqrt(Math.PI) / 2, 4: (2 * Math.sqrt(2 / 3)) / Math.sqrt(Math.PI), 5: (3 * Math.sqrt(2 * Math.PI)) / 8 };
const a3Of = (n: 2 | 3 | 4) => 3 / (c4Of[n] * Math.sqrt(n));

describe("zoneBoundaries", () => {
  it("places the zone lines at centre ± 1σ, 2σ, 3σ", () => {
    expect(zoneBoundaries(10, 2)).toEqual({ lower3: 4, lower2: 6, lower1: 8, upper1: 12, upper2: 14, upper3: 16 });
  });
});

describe("individualsChart", () => {
  it("estimates σ̂ = MR̄/d₂(2) from moving ranges: 10, 12, 11, 13 → MR̄ = 5/3, σ̂ = (5/3)·√π/2", () => {
    const chart = individualsChart([10, 12, 11, 13]);
    expect(chart.movingRanges).toEqual([2, 1, 2]);
    expect(chart.center).toBe(11.5);
    expect(chart.mrBar).toBeCloseTo(5 / 3, 14);
    expect(chart.sigma).toBeCloseTo(5 / 3 / d2Of2, 13);
    // The PRODUCT spec's printed d₂ = 1.128 gives the same σ̂ to 3 significant figures.
    expect(chart.sigma).toBeCloseTo(5 / 3 / 1.128, 3);
    expect(chart.ucl).toBeCloseTo(11.5 + (3 * 5) / 3 / d2Of2, 13);
    expect(chart.lcl).toBeCloseTo(11.5 - (3 * 5) / 3 / d2Of2, 13);
    expect(chart.zones.upper2).toBeCloseTo(11.5 + 2 * chart.sigma, 13);
  });

  it("puts the moving-range limits at D₃(2)·MR̄ = 0 and D₄(2)·MR̄ ≈ 3.267·MR̄", () => {
    const chart = individualsChart([10, 12, 11, 13]);
    expect(chart.mrUcl).toBeCloseTo((d4Of2 * 5) / 3, 12);
    expect(chart.mrLcl).toBe(0);
  });

  it("collapses the limits onto the centre when every value is the same", () => {
    const chart = individualsChart([5, 5, 5]);
    expect(chart).toMatchObject({ center: 5, sigma: 0, ucl: 5, lcl: 5, mrBar: 0 });
  });

  it("refuses fewer than two values and non-finite values", () => {
    expect(() => individualsChart([1])).toThrow(RangeError);
    expect(() => individualsChart([1, Number.NaN, 3])).toThrow(RangeError);
  });
});

describe("xbarSLimits", () => {
  it("sets x̿ ± A₃(n)·s̄, B₃(n)·s̄ … B₄(n)·s̄, and σ of a mean = A₃(n)·s̄/3", () => {
    const k = chartConstants(6);
    const limits = xbarSLimits(100, 2, 6);
    expect(limits.ucl).toBeCloseTo(100 + 2 * k.A3, 12);
    expect(limits.lcl).toBeCloseTo(100 - 2 * k.A3, 12);
    expect(limits.sUcl).toBeCloseTo(2 * k.B4, 12);
    expect(limits.sLcl).toBeCloseTo(2 * k.B3, 12);
    expect(limits.sigma).toBeCloseTo(2 / (k.c4 * Math.sqrt(6)), 12);
  });

  it("refuses a subgroup size below 2", () => {
    expect(() => xbarSLimits(0, 1, 1)).toThrow(RangeError);
  });
});

describe("xbarSChart with equal subgroup sizes", () => {
  const subgroups = [
    [1, 2, 3],
    [2, 3, 4],
    [3, 4, 5],
    [4, 6, 8],
  ];
  const chart = xbarSChart(subgroups);

  it("averages the subgroup sds: s = 1, 1, 1, 2 → s̄ = 1.25, x̿ = 3.75", () => {
    expect(chart.pooled).toBe(false);
    expect(chart.center).toBeCloseTo(3.75, 14);
    expect(chart.sBar).toBeCloseTo(1.25, 14);
    subgroups.forEach((values, i) => expect(chart.points[i]?.s).toBeCloseTo(sampleStandardDeviation(values), 14));
  });

  it("uses A₃(3) = 6/√(3π) and B₄(3) for every point and σ̂ = s̄/c₄(3)", () => {
    for (const point of chart.points) {
      expect(point.ucl).toBeCloseTo(3.75 + a3Of(3) * 1.25, 12);
      expect(point.lcl).toBeCloseTo(3.75 - a3Of(3) * 1.25, 12);
      expect(point.sLcl).toBe(0);
    }
    expect(chart.points[0]?.sUcl).toBeCloseTo((1 + (3 * Math.sqrt(1 - Math.PI / 4)) / c4Of[3]) * 1.25, 12);
    expect(chart.withinSigma).toBeCloseTo(1.25 / c4Of[3], 12);
  });

  it("reports each mean's z-score against its own σ", () => {
    const last = chart.points[3];
    expect(last?.mean).toBe(6);
    expect(last?.zScore).toBeCloseTo((6 - 3.75) / ((a3Of(3) * 1.25) / 3), 12);
    expect(last?.zones.upper3).toBeCloseTo(last?.ucl ?? Number.NaN, 12);
  });
});

describe("xbarSChart with unequal subgroup sizes", () => {
  // n = 2: 1, 3 (x̄ 2, s² 2); n = 4: 2, 4, 6, 8 (x̄ 5, s² 20/3).
  // x̿ = (2·2 + 4·5)/6 = 4; pooled s̄ = √((1·2 + 3·20/3)/(1 + 3)) = √5.5; ν = 4 → σ̂ = s̄/c₄(5).
  const chart = xbarSChart([
    [1, 3],
    [2, 4, 6, 8],
  ]);

  it("weights the grand mean by size and pools the variances (textbook variable-n approach)", () => {
    expect(chart.pooled).toBe(true);
    expect(chart.center).toBeCloseTo(4, 14);
    expect(chart.sBar).toBeCloseTo(Math.sqrt(5.5), 14);
    expect(chart.withinSigma).toBeCloseTo(Math.sqrt(5.5) / c4Of[5], 12);
  });

  it("gives each subgroup limits x̿ ± A₃(nᵢ)·s̄ for its own size", () => {
    expect(chart.points[0]?.ucl).toBeCloseTo(4 + a3Of(2) * Math.sqrt(5.5), 12);
    expect(chart.points[1]?.ucl).toBeCloseTo(4 + a3Of(4) * Math.sqrt(5.5), 12);
    expect(chart.points[1]?.lcl).toBeCloseTo(4 - a3Of(4) * Math.sqrt(5.5), 12);
    expect(chart.points[0]?.zScore).toBeCloseTo((2 - 4) / ((a3Of(2) * Math.sqrt(5.5)) / 3), 12);
  });
});

describe("xbarSChart input checks", () => {
  it("collapses the limits when every subgroup has zero spread", () => {
    const chart = xbarSChart([
      [2, 2],
      [2, 2],
    ]);
    expect(chart.sBar).toBe(0);
    expect(chart.points[0]).toMatchObject({ ucl: 2, lcl: 2, sUcl: 0 });
  });

  it("refuses no subgroups, a subgroup of one and non-finite values", () => {
    expect(() => xbarSChart([])).toThrow(RangeError);
    expect(() => xbarSChart([[1, 2], [3]])).toThrow(RangeError);
    expect(() => xbarSChart([[1, Number.POSITIVE_INFINITY]])).toThrow(RangeError);
  });
});

describe("xbarSChartFromStats", () => {
  const summarise = (groups: number[][]) => groups.map((g) => ({ size: g.length, mean: referenceMean(g), s: sampleStandardDeviation(g) }));

  it("gives the chart of xbarSChart from sizes, means and sds (means and sds from simple-statistics)", () => {
    for (const groups of [[[1, 3], [2, 4, 6, 8]], [[1, 2, 3], [2, 3, 4], [0, 3, 6]]]) {
      const fromValues = xbarSChart(groups);
      const fromStats = xbarSChartFromStats(summarise(groups));
      expect(fromStats.pooled).toBe(fromValues.pooled);
      for (const key of ["center", "sBar", "withinSigma"] as const) expect(fromStats[key]).toBeCloseTo(fromValues[key], 13);
      fromStats.points.forEach((p, i) => {
        expect(p.ucl).toBeCloseTo(fromValues.points[i]!.ucl, 13);
        expect(p.zScore).toBeCloseTo(fromValues.points[i]!.zScore, 12);
      });
    }
  });

  it("refuses no subgroups, a size below 2 or a non-integer size, and a non-finite or negative sd", () => {
    expect(() => xbarSChartFromStats([])).toThrow(RangeError);
    expect(() => xbarSChartFromStats([{ size: 1, mean: 1, s: 0 }])).toThrow(RangeError);
    expect(() => xbarSChartFromStats([{ size: 2.5, mean: 1, s: 0 }])).toThrow(RangeError);
    expect(() => xbarSChartFromStats([{ size: 2, mean: 1, s: Number.NaN }])).toThrow(RangeError);
    expect(() => xbarSChartFromStats([{ size: 2, mean: 1, s: -1 }])).toThrow(RangeError);
  });
});
