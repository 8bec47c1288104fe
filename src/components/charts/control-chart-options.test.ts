import { describe, expect, it } from "vitest";
import { controlChartOption, controlExtent, controlLines, type ControlChartInput } from "./control-chart-options";

// Centre 10 µS, σ = 0.5 µS, limits at ±3σ; the fourth lot broke Western Electric rule 1.
const input: ControlChartInput = {
  points: [
    { label: "L1", value: 10.2, violations: [] },
    { label: "L2", value: 9.7, violations: [] },
    { label: "L3", value: 10.4, violations: [] },
    { label: "L4", value: 11.8, violations: ["WE1: one point beyond 3σ"] },
  ],
  center: 10,
  ucl: 11.5,
  lcl: 8.5,
  sigma: 0.5,
  unitLabel: "µS",
};

type Series = { id: string; data: unknown[]; symbol?: string; itemStyle?: { color: string } };

describe("controlLines", () => {
  it("draws CL, UCL, LCL and the ±1σ, ±2σ zones at centre + kσ", () => {
    const lines = controlLines(input);
    const byName = Object.fromEntries(lines.map((l) => [(l as { name: string }).name, (l as { yAxis: number }).yAxis]));
    expect(byName).toEqual({ UCL: 11.5, CL: 10, LCL: 8.5, "−2σ": 9, "−1σ": 9.5, "+1σ": 10.5, "+2σ": 11 });
    const zone = lines.find((l) => (l as { name: string }).name === "+1σ") as { lineStyle: { type: string } };
    expect(zone.lineStyle.type).toBe("dashed");
  });

  it("adds the yield floor only when one is given, and labels limits with the unit", () => {
    expect(controlLines(input).some((l) => (l as { name: string }).name === "Yield floor")).toBe(false);
    const withFloor = controlLines({ ...input, yieldFloor: 9 });
    expect(withFloor.find((l) => (l as { name: string }).name === "Yield floor")).toMatchObject({ yAxis: 9 });
    const ucl = withFloor[0] as { label: { formatter: string } };
    expect(ucl.label.formatter).toBe("UCL 11.5 µS");
  });
});

describe("controlChartOption", () => {
  const option = controlChartOption(input);
  const [values, flagged] = option.series as [Series, Series];

  it("redraws only the points that broke a rule, as triangles in a distinct colour", () => {
    expect(values.data).toEqual([10.2, 9.7, 10.4, 11.8]);
    expect(flagged.data).toEqual([[3, 11.8]]);
    expect(flagged.symbol).toBe("triangle");
    expect(flagged.itemStyle?.color).not.toBe((values as { itemStyle?: { color: string } }).itemStyle?.color);
  });

  it("names the broken rule in the tooltip", () => {
    const formatter = (option.tooltip as { formatter: (p: unknown) => string }).formatter;
    expect(formatter([{ dataIndex: 3 }])).toContain("WE1: one point beyond 3σ");
    expect(formatter([{ dataIndex: 0 }])).not.toContain("Rule broken");
  });

  it("fits every point and limit on the value axis", () => {
    const { min, max } = controlExtent(input);
    expect(min).toBeLessThan(8.5);
    expect(max).toBeGreaterThan(11.8);
    expect((option.yAxis as { min: number }).min).toBe(min);
  });
});
