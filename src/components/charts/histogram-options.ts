import type { LineSeriesOption } from "echarts/charts";
import type { GridComponentOption, LegendComponentOption, TooltipComponentOption } from "echarts/components";
import type { ComposeOption } from "echarts/core";
import { formatPlain } from "@/domain/transport/format-si";
import { AXIS_STYLE, seriesColour, TEXT_STYLE, TOOLTIP_STYLE, tooltipHtml } from "./chart-theme";

export type HistogramOption = ComposeOption<GridComponentOption | LegendComponentOption | LineSeriesOption | TooltipComponentOption>;

export interface HistogramSeries {
  /** e.g. "Wafer 7". */
  readonly name: string;
  /** Count per bin; counts[i] covers [edges[i], edges[i + 1]). */
  readonly counts: readonly number[];
}

export interface HistogramInput {
  /** Bin edges in the display unit, strictly increasing, one more than each series' counts. */
  readonly edges: readonly number[];
  readonly series: readonly HistogramSeries[];
  /** x axis title with its unit, e.g. "G (µS)". */
  readonly valueTitle: string;
  /** y axis title; default "Dies". */
  readonly countTitle?: string;
}

/**
 * Outline of a histogram as a polyline: (e₀, 0), then (eᵢ, cᵢ), (eᵢ₊₁, cᵢ) for each bin, then (eₙ, 0).
 * RangeError unless edges has counts.length + 1 entries; no bins gives [].
 */
export function histogramOutline(edges: readonly number[], counts: readonly number[]): [number, number][] {
  if (edges.length !== counts.length + 1) throw new RangeError(`${counts.length} counts need ${counts.length + 1} edges, got ${edges.length}`);
  if (counts.length === 0) return [];
  const points: [number, number][] = [[edges[0] as number, 0]];
  counts.forEach((count, i) => {
    points.push([edges[i] as number, count], [edges[i + 1] as number, count]);
  });
  points.push([edges[edges.length - 1] as number, 0]);
  return points;
}

/** Index i of the bin [edges[i], edges[i + 1]) holding value, the last bin closed on the right; null outside. */
export function binIndexOf(edges: readonly number[], value: number): number | null {
  let low = 0;
  let high = edges.length - 1;
  if (!(high >= 1) || !(value >= (edges[0] as number)) || value > (edges[high] as number)) return null;
  while (high - low > 1) {
    const mid = (low + high) >> 1;
    if (value >= (edges[mid] as number)) low = mid;
    else high = mid;
  }
  return low;
}

/**
 * Conductance distribution of several wafers overlaid: one stepped outline per series (lightly filled, Okabe–Ito
 * colours) over shared, pre-computed bin edges. The axis tooltip lists every series' count in the bin under the
 * pointer. RangeError when a series' counts do not match the edges.
 */
export function histogramOption(input: HistogramInput): HistogramOption {
  const { edges, series, valueTitle, countTitle = "Dies" } = input;
  const outlines = series.map((s) => histogramOutline(edges, s.counts));
  return {
    animation: false,
    textStyle: TEXT_STYLE,
    grid: { left: 56, right: 24, top: 40, bottom: 48 },
    legend: { top: 4, type: "scroll", textStyle: TEXT_STYLE },
    tooltip: {
      ...TOOLTIP_STYLE,
      trigger: "axis",
      // Unsnapped, the pointer's own value picks the bin rather than the nearest outline corner.
      axisPointer: { type: "line", snap: false },
      formatter: (params) => {
        const first = Array.isArray(params) ? params[0] : params;
        const bin = binIndexOf(edges, Number((first as { axisValue?: unknown } | undefined)?.axisValue));
        if (bin === null) return "";
        const heading = `${valueTitle}: ${formatPlain(edges[bin] as number)} to ${formatPlain(edges[bin + 1] as number)}`;
        return tooltipHtml(heading, series.map((s) => ({ label: s.name, value: String(s.counts[bin] ?? 0) })));
      },
    },
    xAxis: {
      type: "value",
      name: valueTitle,
      nameLocation: "middle",
      nameGap: 28,
      min: edges[0],
      max: edges[edges.length - 1],
      ...AXIS_STYLE,
    },
    yAxis: { type: "value", name: countTitle, minInterval: 1, ...AXIS_STYLE },
    series: series.map(
      (s, i): LineSeriesOption => ({
        type: "line",
        id: `histogram-${i}`,
        name: s.name,
        data: outlines[i],
        showSymbol: false,
        lineStyle: { color: seriesColour(i), width: 1.5 },
        itemStyle: { color: seriesColour(i) },
        areaStyle: { color: seriesColour(i), opacity: series.length > 1 ? 0.12 : 0.3 },
      }),
    ),
  };
}
