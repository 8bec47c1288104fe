import type { LineSeriesOption } from "echarts/charts";
import type { GridComponentOption } from "echarts/components";
import type { ComposeOption } from "echarts/core";
import { ACCENT } from "./chart-theme";

export type SparklineOption = ComposeOption<GridComponentOption | LineSeriesOption>;

/**
 * A tiny trend line: no axes, labels or tooltip, the y range fitted to the values, the last value dotted.
 * Non-finite values leave gaps.
 */
export function sparklineOption(values: readonly number[], colour: string = ACCENT): SparklineOption {
  const last = values.length - 1;
  return {
    animation: false,
    grid: { left: 3, right: 3, top: 3, bottom: 3 },
    xAxis: { type: "category", show: false, boundaryGap: false, data: values.map((_, i) => i) },
    yAxis: { type: "value", show: false, scale: true },
    series: [
      {
        type: "line",
        id: "trend",
        data: values.map((v, i) => ({
          value: Number.isFinite(v) ? v : "-",
          symbol: i === last ? "circle" : "none",
          symbolSize: i === last ? 4 : 0,
        })),
        lineStyle: { color: colour, width: 1.25 },
        itemStyle: { color: colour },
        silent: true,
      },
    ],
  };
}
