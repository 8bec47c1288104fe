"use client";

import type { EChartsCoreOption, EChartsType } from "echarts/core";
import { useCallback, useEffect, useRef } from "react";
import { chartImageApi, type ChartImageApi } from "./chart-export";
import { echarts } from "./echarts-setup";
import { ReactEChartsCore } from "./react-echarts";

export interface ChartFrameProps {
  option: EChartsCoreOption;
  ariaLabel: string;
  /** CSS height of the chart box; the width fills the parent. */
  height?: number | string;
  className?: string;
  /** Receives the PNG export once the chart is drawn. */
  onReady?: (api: ChartImageApi) => void;
}

const CHART_STYLE = { width: "100%", height: "100%" };

/**
 * The box every small Lotwarden chart sits in: an image role with an accessible name, and the echarts core
 * component with only the registered parts. The option replaces the previous one whole (`notMerge`), so
 * series that come and go are dropped; keep the option memoised in the caller.
 */
export function ChartFrame({ option, ariaLabel, height = 320, className = "", onReady }: ChartFrameProps) {
  const onReadyRef = useRef(onReady);
  useEffect(() => {
    onReadyRef.current = onReady;
  });
  const handleReady = useCallback((instance: EChartsType) => onReadyRef.current?.(chartImageApi(instance)), []);
  return (
    <div role="img" aria-label={ariaLabel} className={`w-full ${className}`} style={{ height }}>
      <ReactEChartsCore echarts={echarts} option={option} notMerge onChartReady={handleReady} style={CHART_STYLE} />
    </div>
  );
}
