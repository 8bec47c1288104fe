import type { LineSeriesOption, ScatterSeriesOption } from "echarts/charts";
import type { GridComponentOption, LegendComponentOption, MarkLineComponentOption, TooltipComponentOption } from "echarts/components";
import type { ComposeOption } from "echarts/core";
import { formatPlain } from "@/domain/transport/format-si";
import { ACCENT, ALERT, AXIS_STYLE, CAUTION, INK, INK_MUTED, SLATE_LINE, TEXT_STYLE, TOOLTIP_STYLE, tooltipHtml } from "./chart-theme";

export type ControlChartOption = ComposeOption<
  GridComponentOption | LegendComponentOption | LineSeriesOption | MarkLineComponentOption | ScatterSeriesOption | TooltipComponentOption
>;

export interface ControlPoint {
  /** Lot number, wafer or date shown on the axis. */
  readonly label: string;
  readonly value: number;
  /** Names of the rules this point broke, e.g. "WE1: beyond 3σ"; empty when in control. */
  readonly violations: readonly string[];
}

export interface ControlChartInput {
  readonly points: readonly ControlPoint[];
  readonly center: number;
  readonly ucl: number;
  readonly lcl: number;
  /** One sigma of the plotted statistic (σ̂ of an individual, or σ̂/√n for an X̄ chart): the zone width. */
  readonly sigma: number;
  /** Unit printed beside values, e.g. "µS" or "%"; empty for none. */
  readonly unitLabel: string;
  readonly yieldFloor?: number | null;
}

type MarkLineDatum = NonNullable<NonNullable<LineSeriesOption["markLine"]>["data"]>[number];

function withUnit(value: number, unit: string): string {
  return unit ? `${formatPlain(value)} ${unit}` : formatPlain(value);
}

function limitLine(name: string, value: number, colour: string, type: "solid" | "dashed", width: number, unit: string, label: boolean): MarkLineDatum {
  return {
    name,
    yAxis: value,
    lineStyle: { color: colour, type, width },
    label: { show: label, position: "end", formatter: `${name} ${withUnit(value, unit)}`, color: colour, fontFamily: TEXT_STYLE.fontFamily },
  };
}

/** Horizontal reference lines: CL solid, UCL/LCL solid red, ±1σ and ±2σ dashed, and the yield floor when given. */
export function controlLines(input: ControlChartInput): MarkLineDatum[] {
  const { center, ucl, lcl, sigma, unitLabel, yieldFloor } = input;
  const lines = [
    limitLine("UCL", ucl, ALERT, "solid", 1.5, unitLabel, true),
    limitLine("CL", center, INK, "solid", 1.5, unitLabel, true),
    limitLine("LCL", lcl, ALERT, "solid", 1.5, unitLabel, true),
  ];
  if (Number.isFinite(sigma) && sigma > 0) {
    for (const k of [-2, -1, 1, 2]) lines.push(limitLine(`${k > 0 ? "+" : "−"}${Math.abs(k)}σ`, center + k * sigma, INK_MUTED, "dashed", 1, unitLabel, false));
  }
  if (yieldFloor !== undefined && yieldFloor !== null && Number.isFinite(yieldFloor)) {
    lines.push(limitLine("Yield floor", yieldFloor, CAUTION, "dashed", 1.5, unitLabel, true));
  }
  return lines;
}

/** y range holding every point and line with 5 % headroom (mark lines do not widen an echarts axis by themselves). */
export function controlExtent(input: ControlChartInput): { min: number; max: number } {
  const values = [input.ucl, input.lcl, input.center, ...input.points.map((p) => p.value)];
  if (input.yieldFloor !== undefined && input.yieldFloor !== null) values.push(input.yieldFloor);
  const finite = values.filter(Number.isFinite);
  const low = Math.min(...finite);
  const high = Math.max(...finite);
  const pad = high > low ? (high - low) * 0.05 : Math.abs(high) * 0.05 || 1;
  return { min: low - pad, max: high + pad };
}

/**
 * Individuals or X̄ control chart (§6): points joined in order, CL, UCL, LCL and the ±1σ/±2σ zones as lines,
 * the yield floor if given, and points that broke a rule drawn again as red triangles, the rules named in the
 * tooltip. Values and limits in the caller's unit (`unitLabel`).
 */
export function controlChartOption(input: ControlChartInput): ControlChartOption {
  const { points, unitLabel } = input;
  const extent = controlExtent(input);
  const flagged = points.flatMap((p, i) => (p.violations.length > 0 ? [[i, p.value]] : []));
  return {
    animation: false,
    textStyle: TEXT_STYLE,
    grid: { left: 64, right: 112, top: 40, bottom: 48 },
    legend: { top: 4, data: ["Value", "Rule broken"], textStyle: TEXT_STYLE },
    tooltip: {
      ...TOOLTIP_STYLE,
      trigger: "axis",
      formatter: (params) => {
        const index = (Array.isArray(params) ? params[0] : params)?.dataIndex;
        const point = index === undefined ? undefined : points[index];
        if (point === undefined) return "";
        const rows = [{ label: "Value", value: withUnit(point.value, unitLabel) }];
        for (const rule of point.violations) rows.push({ label: "Rule broken", value: rule });
        return tooltipHtml(point.label, rows);
      },
    },
    xAxis: { type: "category", data: points.map((p) => p.label), boundaryGap: false, ...AXIS_STYLE, splitLine: { show: false } },
    yAxis: {
      type: "value",
      min: extent.min,
      max: extent.max,
      name: unitLabel,
      ...AXIS_STYLE,
      // The padded extent is not a round number: label the inner ticks only.
      axisLabel: { ...AXIS_STYLE.axisLabel, showMinLabel: false, showMaxLabel: false },
      splitLine: { lineStyle: { color: SLATE_LINE, opacity: 0.5 } },
    },
    series: [
      {
        type: "line",
        id: "value",
        name: "Value",
        data: points.map((p) => p.value),
        symbol: "circle",
        symbolSize: 6,
        lineStyle: { color: ACCENT, width: 1.5 },
        itemStyle: { color: ACCENT },
        markLine: { silent: true, symbol: "none", animation: false, data: controlLines(input) },
      },
      {
        type: "scatter",
        id: "violations",
        name: "Rule broken",
        data: flagged,
        symbol: "triangle",
        symbolSize: 13,
        itemStyle: { color: ALERT, borderColor: "#ffffff", borderWidth: 1 },
        z: 5,
        tooltip: { show: false },
      },
    ],
  };
}
