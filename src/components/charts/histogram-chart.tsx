"use client";

import { useMemo } from "react";
import type { ChartImageApi } from "./chart-export";
import { ChartFrame } from "./chart-frame";
import { histogramOption, type HistogramInput } from "./histogram-options";

export interface HistogramChartProps extends HistogramInput {
  ariaLabel: string;
  height?: number | string;
  onReady?: (api: ChartImageApi) => void;
}

/**
 * Conductance distribution per wafer, overlaid as stepped outlines over shared bin edges. Takes pre-binned
 * counts (edges in the display unit, `valueTitle` such as "G (µS)"), so the page decides the binning.
 */
export function HistogramChart({ edges, series, valueTitle, countTitle, ariaLabel, height, onReady }: HistogramChartProps) {
  const option = useMemo(() => histogramOption({ edges, series, valueTitle, countTitle }), [edges, series, valueTitle, countTitle]);
  return <ChartFrame option={option} ariaLabel={ariaLabel} height={height} onReady={onReady} />;
}
