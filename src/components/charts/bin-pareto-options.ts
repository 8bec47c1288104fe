import type { BarSeriesOption, LineSeriesOption } from "echarts/charts";
import type { GridComponentOption, LegendComponentOption, TooltipComponentOption } from "echarts/components";
import type { ComposeOption } from "echarts/core";
import { BIN_COLOURS } from "@/domain/wafer-map/bin-colours";
import type { ParetoEntry } from "@/domain/yield/yield";
import { AXIS_STYLE, INK, TEXT_STYLE, TOOLTIP_STYLE, tooltipHtml } from "./chart-theme";

export type BinParetoOption = ComposeOption<BarSeriesOption | GridComponentOption | LegendComponentOption | LineSeriesOption | TooltipComponentOption>;

function percent(value: number): string {
  return `${value.toFixed(1)} %`;
}

/**
 * Bin Pareto (§7) of failing dies in the order given (binPareto sorts them, largest first): one bar per bin in
 * its §14 colour against die count, and the cumulative share of fails as a line on a 0–100 % right axis.
 * No entries draws empty axes.
 */
export function binParetoOption(entries: readonly ParetoEntry[]): BinParetoOption {
  return {
    animation: false,
    textStyle: TEXT_STYLE,
    grid: { left: 56, right: 56, top: 40, bottom: 36 },
    legend: { top: 4, data: ["Dies", "Cumulative"], textStyle: TEXT_STYLE },
    tooltip: {
      ...TOOLTIP_STYLE,
      trigger: "axis",
      axisPointer: { type: "shadow" },
      formatter: (params) => {
        const index = (Array.isArray(params) ? params[0] : params)?.dataIndex;
        const entry = index === undefined ? undefined : entries[index];
        if (entry === undefined) return "";
        return tooltipHtml(entry.bin, [
          { label: "Dies", value: String(entry.count) },
          { label: "Share of fails", value: percent(entry.percentOfFails) },
          { label: "Cumulative", value: percent(entry.cumulativePercent) },
        ]);
      },
    },
    xAxis: { type: "category", data: entries.map((e) => e.bin), ...AXIS_STYLE },
    yAxis: [
      { type: "value", name: "Dies", minInterval: 1, ...AXIS_STYLE },
      { type: "value", name: "Cumulative (%)", min: 0, max: 100, interval: 25, ...AXIS_STYLE, splitLine: { show: false } },
    ],
    series: [
      {
        type: "bar",
        id: "dies",
        name: "Dies",
        data: entries.map((e) => ({ value: e.count, itemStyle: { color: BIN_COLOURS[e.bin] } })),
        itemStyle: { color: BIN_COLOURS.NODATA },
        barMaxWidth: 56,
      },
      {
        type: "line",
        id: "cumulative",
        name: "Cumulative",
        yAxisIndex: 1,
        data: entries.map((e) => e.cumulativePercent),
        symbol: "circle",
        symbolSize: 6,
        lineStyle: { color: INK, width: 1.5 },
        itemStyle: { color: INK },
      },
    ],
  };
}
