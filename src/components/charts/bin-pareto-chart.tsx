"use client";

import { useMemo } from "react";
import type { ParetoEntry } from "@/domain/yield/yield";
import { binParetoOption } from "./bin-pareto-options";
import type { ChartImageApi } from "./chart-export";
import { ChartFrame } from "./chart-frame";

export interface BinParetoChartProps {
  /** Failing bins, largest first, as `binPareto` (domain/yield) returns them. */
  entries: readonly ParetoEntry[];
  ariaLabel: string;
  height?: number | string;
  onReady?: (api: ChartImageApi) => void;
}

/** Bin Pareto of a wafer or lot: bars per failing bin in the bin colours, cumulative share of fails as a line. */
export function BinParetoChart({ entries, ariaLabel, height, onReady }: BinParetoChartProps) {
  const option = useMemo(() => binParetoOption(entries), [entries]);
  return <ChartFrame option={option} ariaLabel={ariaLabel} height={height} onReady={onReady} />;
}
