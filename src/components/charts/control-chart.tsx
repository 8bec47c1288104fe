"use client";

import { useMemo } from "react";
import type { ChartImageApi } from "./chart-export";
import { ChartFrame } from "./chart-frame";
import { controlChartOption, type ControlChartInput } from "./control-chart-options";

export interface ControlChartProps extends ControlChartInput {
  ariaLabel: string;
  height?: number | string;
  onReady?: (api: ChartImageApi) => void;
}

/**
 * Individuals or X̄ control chart: points in order, centre line, UCL/LCL, dashed ±1σ/±2σ zones, optional yield
 * floor; points that broke a rule are red triangles and the tooltip names the rules. Fed plain arrays.
 */
export function ControlChart({ points, center, ucl, lcl, sigma, unitLabel, yieldFloor, ariaLabel, height, onReady }: ControlChartProps) {
  const option = useMemo(
    () => controlChartOption({ points, center, ucl, lcl, sigma, unitLabel, yieldFloor }),
    [points, center, ucl, lcl, sigma, unitLabel, yieldFloor],
  );
  return <ChartFrame option={option} ariaLabel={ariaLabel} height={height} onReady={onReady} />;
}
