import { describe, expect, it } from "vitest";
import { BIN_COLOURS } from "@/domain/wafer-map/bin-colours";
import { binPareto } from "@/domain/yield/yield";
import { binParetoOption } from "./bin-pareto-options";

type Bar = { data: { value: number; itemStyle: { color: string } }[] };
type Line = { data: number[]; yAxisIndex: number };

describe("binParetoOption", () => {
  // 3 OPEN, 1 SHORT, 6 PASS: fails 75 % OPEN, 25 % SHORT
  const entries = binPareto(["OPEN", "PASS", "OPEN", "SHORT", "PASS", "OPEN", "PASS", "PASS", "PASS", "PASS"]);
  const option = binParetoOption(entries);
  const [bars, line] = option.series as [Bar, Line];

  it("draws one bar per failing bin, largest first, in the bin colour", () => {
    expect((option.xAxis as { data: string[] }).data).toEqual(["OPEN", "SHORT"]);
    expect(bars.data.map((d) => d.value)).toEqual([3, 1]);
    expect(bars.data.map((d) => d.itemStyle.color)).toEqual([BIN_COLOURS.OPEN, BIN_COLOURS.SHORT]);
  });

  it("plots the cumulative share of fails on a 0–100 % right axis", () => {
    expect(line.yAxisIndex).toBe(1);
    expect(line.data).toEqual([75, 100]);
    const [, right] = option.yAxis as { min: number; max: number }[];
    expect([right?.min, right?.max]).toEqual([0, 100]);
  });

  it("names the bin, count and shares in the tooltip", () => {
    const formatter = (option.tooltip as { formatter: (p: unknown) => string }).formatter;
    const html = formatter([{ dataIndex: 0 }]);
    expect(html).toContain("OPEN");
    expect(html).toContain("75.0 %");
  });

  it("draws empty axes for a wafer with no fails", () => {
    const empty = binParetoOption([]);
    expect((empty.series as Bar[])[0]?.data).toEqual([]);
  });
});
