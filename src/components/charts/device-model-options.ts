import type { EChartsCoreOption } from "echarts/core";
import type { DeviceModelCurves } from "@/domain/device-model";
import { CONDUCTANCE_QUANTUM_S } from "@/domain/transport/constants";
import { FONT_FAMILY as CHART_FONT, INK, INK_MUTED as MUTED, SLATE_LINE as GRID_LINE } from "./chart-theme";

const axisStyle = { axisLabel: { color: MUTED, fontFamily: CHART_FONT }, nameTextStyle: { color: MUTED, fontFamily: CHART_FONT }, splitLine: { lineStyle: { color: GRID_LINE } } };

/** G(E) (in G₀) and the thermal broadening F_T (1/eV) on one energy axis (eV), μ marked. */
export function energyWindowOption(c: DeviceModelCurves): EChartsCoreOption {
  return {
    textStyle: { fontFamily: CHART_FONT, color: INK },
    grid: { left: 64, right: 64, top: 56, bottom: 48 },
    legend: { top: 0, textStyle: { color: INK } },
    tooltip: { trigger: "axis", valueFormatter: (v: unknown) => (typeof v === "number" ? v.toPrecision(4) : String(v)) },
    xAxis: { type: "value", name: "E − μ (meV)", nameLocation: "middle", nameGap: 28, min: "dataMin", max: "dataMax", ...axisStyle },
    yAxis: [
      { type: "value", name: "G(E) (G₀)", ...axisStyle },
      { type: "value", name: "F_T (1/eV)", position: "right", ...axisStyle, splitLine: { show: false } },
    ],
    series: [
      { name: "G(E)", type: "line", showSymbol: false, lineStyle: { color: "#0072B2", width: 2 }, itemStyle: { color: "#0072B2" }, data: c.energy.map((p) => [(p.energyEv - c.fermiLevelEv) * 1e3, p.conductanceS / CONDUCTANCE_QUANTUM_S]) },
      { name: "F_T = −∂f/∂E", type: "line", yAxisIndex: 1, showSymbol: false, areaStyle: { color: "rgba(230,159,0,0.18)" }, lineStyle: { color: "#E69F00", width: 2 }, itemStyle: { color: "#E69F00" }, data: c.energy.map((p) => [(p.energyEv - c.fermiLevelEv) * 1e3, p.broadeningPerEv]), markLine: { symbol: "none", label: { formatter: "μ", color: MUTED }, lineStyle: { color: MUTED, type: "dashed" }, data: [{ xAxis: 0 }] } },
    ],
  };
}

/** Expected linear-response G (in G₀) against a swept variable. */
export function expectedCurveOption(points: [number, number][], xName: string, marker?: { x: number; label: string }, measured?: [number, number][]): EChartsCoreOption {
  return {
    textStyle: { fontFamily: CHART_FONT, color: INK },
    grid: { left: 64, right: 24, top: 52, bottom: 48 },
    legend: { top: 0, textStyle: { color: INK } },
    tooltip: { trigger: "axis", valueFormatter: (v: unknown) => (typeof v === "number" ? v.toPrecision(4) : String(v)) },
    xAxis: { type: "value", name: xName, nameLocation: "middle", nameGap: 28, min: "dataMin", max: "dataMax", ...axisStyle },
    yAxis: { type: "value", name: "expected G (G₀)", scale: true, ...axisStyle },
    series: [
      { name: "expected G", type: "line", showSymbol: false, lineStyle: { color: "#0072B2", width: 2 }, itemStyle: { color: "#0072B2" }, data: points, ...(marker ? { markLine: { symbol: "none", label: { formatter: marker.label, color: MUTED }, lineStyle: { color: MUTED, type: "dashed" }, data: [{ xAxis: marker.x }] } } : {}) },
      ...(measured?.length ? [{ name: "measured lot medians", type: "scatter", symbolSize: 7, itemStyle: { color: "#009E73" }, data: measured }] : []),
    ],
  };
}
