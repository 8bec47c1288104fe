"use client";

import { useMemo } from "react";
import { ChartFrame } from "./chart-frame";
import { sparklineOption } from "./sparkline-options";

export interface SparklineProps {
  values: readonly number[];
  ariaLabel: string;
  /** CSS width; default 96 px. */
  width?: number | string;
  /** CSS height; default 24 px. */
  height?: number | string;
  colour?: string;
}

/** A tiny line for a trend beside a number in a table or card; no axes, no tooltip. */
export function Sparkline({ values, ariaLabel, width = 96, height = 24, colour }: SparklineProps) {
  const option = useMemo(() => sparklineOption(values, colour), [values, colour]);
  return (
    <div style={{ width }} className="inline-block align-middle">
      <ChartFrame option={option} ariaLabel={ariaLabel} height={height} />
    </div>
  );
}
