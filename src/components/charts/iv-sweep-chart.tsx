"use client";

import { useMemo } from "react";
import type { ChartImageApi } from "./chart-export";
import { ChartFrame } from "./chart-frame";
import { ivSweepOption, type IvSweepInput } from "./iv-sweep-options";

export interface IvSweepChartProps extends IvSweepInput {
  ariaLabel: string;
  height?: number | string;
  onReady?: (api: ChartImageApi) => void;
}

/**
 * One die's low-bias sweep: measured points in mV against current in a unit chosen by magnitude, the linear
 * fit over the thermal window ±V_w (shaded), and the whole-sweep cubic fit dashed. Fed plain arrays in SI.
 */
export function IvSweepChart({ points, fit, cubic, windowV, ariaLabel, height, onReady }: IvSweepChartProps) {
  const option = useMemo(() => ivSweepOption({ points, fit, cubic, windowV }), [points, fit, cubic, windowV]);
  return <ChartFrame option={option} ariaLabel={ariaLabel} height={height} onReady={onReady} />;
}
