import type { LineSeriesOption, ScatterSeriesOption } from "echarts/charts";
import type { GridComponentOption, LegendComponentOption, MarkAreaComponentOption, TooltipComponentOption } from "echarts/components";
import type { ComposeOption } from "echarts/core";
import { formatPlain } from "@/domain/transport/format-si";
import { ACCENT, AXIS_STYLE, CAUTION, INK, TEXT_STYLE, TOOLTIP_STYLE, tooltipHtml } from "./chart-theme";

export type IvSweepOption = ComposeOption<
  GridComponentOption | LegendComponentOption | LineSeriesOption | MarkAreaComponentOption | ScatterSeriesOption | TooltipComponentOption
>;

export interface IvSweepInput {
  readonly points: readonly { readonly biasV: number; readonly currentA: number }[];
  /** In-window OLS fit I = G·V + I₀ (§5 step 2). */
  readonly fit: { readonly conductanceS: number; readonly offsetA: number };
  /** Whole-sweep cubic I = I₀ + G₁V + a₂V² + a₃V³ (§5 step 3). */
  readonly cubic?: { readonly offsetA: number; readonly conductanceS: number; readonly quadraticAPerV2: number; readonly cubicAPerV3: number } | null;
  readonly windowV: number;
}

export interface CurrentUnit {
  readonly symbol: "A" | "mA" | "µA" | "nA" | "pA";
  /** Amperes per one unit. */
  readonly amperes: number;
}

const CURRENT_UNITS: readonly CurrentUnit[] = [
  { symbol: "A", amperes: 1 },
  { symbol: "mA", amperes: 1e-3 },
  { symbol: "µA", amperes: 1e-6 },
  { symbol: "nA", amperes: 1e-9 },
  { symbol: "pA", amperes: 1e-12 },
];
const CUBIC_SAMPLES = 81;
const MV_PER_V = 1e3;

/** Largest of A, mA, µA, nA, pA in which maxAbsA reads ≥ 1; pA below 1 pA, nA for zero or non-finite input. */
export function currentUnit(maxAbsA: number): CurrentUnit {
  const nano = CURRENT_UNITS[3] as CurrentUnit;
  if (!Number.isFinite(maxAbsA) || maxAbsA <= 0) return nano;
  return CURRENT_UNITS.find((u) => maxAbsA >= u.amperes) ?? (CURRENT_UNITS[4] as CurrentUnit);
}

function cubicAt(c: NonNullable<IvSweepInput["cubic"]>, v: number): number {
  return c.offsetA + v * (c.conductanceS + v * (c.quadraticAPerV2 + v * c.cubicAPerV3));
}

/**
 * The I–V sweep chart: measured points (mV, current in the unit chosen by magnitude), the linear fit drawn
 * over ±V_w, the cubic drawn dashed over the sweep's bias range (81 samples), and the thermal window
 * −V_w…+V_w shaded with a markArea in mV. No points draws the window and the fit line only.
 */
export function ivSweepOption(input: IvSweepInput): IvSweepOption {
  const { points, fit, cubic, windowV } = input;
  const linearAt = (v: number) => fit.conductanceS * v + fit.offsetA;
  const biases = points.map((p) => p.biasV).filter(Number.isFinite);
  const lowV = biases.length > 0 ? Math.min(...biases) : -windowV;
  const highV = biases.length > 0 ? Math.max(...biases) : windowV;
  const cubicV = cubic && highV > lowV ? Array.from({ length: CUBIC_SAMPLES }, (_, i) => lowV + ((highV - lowV) * i) / (CUBIC_SAMPLES - 1)) : [];
  const currents = [...points.map((p) => p.currentA), linearAt(-windowV), linearAt(windowV)];
  const unit = currentUnit(Math.max(...currents.filter(Number.isFinite).map(Math.abs), 0));
  const at = (v: number, i: number) => [v * MV_PER_V, i / unit.amperes];
  const windowMv = windowV * MV_PER_V;
  const series: (LineSeriesOption | ScatterSeriesOption)[] = [
    {
      type: "scatter",
      id: "measured",
      name: "Measured",
      data: points.map((p) => at(p.biasV, p.currentA)),
      symbolSize: 7,
      itemStyle: { color: INK },
      markArea: {
        silent: true,
        itemStyle: { color: "rgba(47, 93, 138, 0.10)" },
        label: { show: true, position: "insideTop", color: ACCENT, fontFamily: TEXT_STYLE.fontFamily },
        data: [[{ name: `Thermal window ±${formatPlain(windowMv)} mV`, xAxis: -windowMv }, { xAxis: windowMv }]],
      },
    },
    {
      type: "line",
      id: "linear-fit",
      name: "Linear fit (|V| ≤ V_w)",
      data: [at(-windowV, linearAt(-windowV)), at(windowV, linearAt(windowV))],
      showSymbol: false,
      lineStyle: { color: ACCENT, width: 2 },
      itemStyle: { color: ACCENT },
      tooltip: { show: false },
    },
  ];
  if (cubic && cubicV.length > 0) {
    series.push({
      type: "line",
      id: "cubic-fit",
      name: "Cubic fit",
      data: cubicV.map((v) => at(v, cubicAt(cubic, v))),
      showSymbol: false,
      lineStyle: { color: CAUTION, width: 1.5, type: "dashed" },
      itemStyle: { color: CAUTION },
      tooltip: { show: false },
    });
  }
  return {
    animation: false,
    textStyle: TEXT_STYLE,
    grid: { left: 64, right: 24, top: 44, bottom: 48 },
    legend: { top: 4, textStyle: TEXT_STYLE },
    tooltip: {
      ...TOOLTIP_STYLE,
      trigger: "item",
      formatter: (params) => {
        const value = (Array.isArray(params) ? params[0] : params)?.value;
        if (!Array.isArray(value)) return "";
        return tooltipHtml(null, [
          { label: "V", value: `${formatPlain(Number(value[0]))} mV` },
          { label: "I", value: `${formatPlain(Number(value[1]))} ${unit.symbol}` },
        ]);
      },
    },
    xAxis: { type: "value", name: "V (mV)", nameLocation: "middle", nameGap: 28, scale: true, ...AXIS_STYLE },
    yAxis: { type: "value", name: `I (${unit.symbol})`, nameLocation: "middle", nameGap: 48, scale: true, ...AXIS_STYLE },
    series,
  };
}
