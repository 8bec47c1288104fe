"use client";

import type { CustomSeriesOption } from "echarts/charts";
import type { CustomSeriesRenderItem } from "echarts";
import { useMemo } from "react";
import { CIVIDIS_STOPS, cividis } from "@/domain/wafer-map/cividis";
import { mapLayout } from "@/domain/wafer-map/layout";
import type { MapGeometry } from "@/domain/wafer-map/map-die";
import type { StackedCell } from "@/domain/yield/spatial-yield";
import { INK_SOFT, TEXT_STYLE, TOOLTIP_STYLE, tooltipHtml } from "./chart-theme";
import { echarts } from "./echarts-setup";
import { ReactEChartsCore } from "./react-echarts";
import { LARGE_ASPECT_RATIO } from "./wafer-map-options";
import { waferDiscRenderer, waferMarksRenderer } from "./wafer-map-render";

export interface RateMapProps {
  /** One cell per die position, as `stackedFailMap` (domain/yield) returns them. */
  cells: readonly StackedCell[];
  geometry: MapGeometry;
  ariaLabel: string;
}

// Data item of a cell: [centreXMm, centreYMm, fail rate in %, cell index].
const DIM = { xMm: 0, yMm: 1, percent: 2, index: 3 } as const;
const CHART_STYLE = { width: "100%", height: "100%" };

function cellRenderer(widthMm: number, heightMm: number): CustomSeriesRenderItem {
  return (_params, api) => {
    const [cx = 0, cy = 0] = api.coord([Number(api.value(DIM.xMm)), Number(api.value(DIM.yMm))]);
    const size = api.size?.([widthMm, heightMm]) ?? [0, 0];
    const [w = 0, h = 0] = Array.isArray(size) ? size : [size, size];
    const gap = Math.min(1, 0.08 * Math.min(w, h));
    const fill = cividis(Number(api.value(DIM.percent)) / 100);
    return { type: "rect", shape: { x: cx - w / 2 + gap / 2, y: cy - h / 2 + gap / 2, width: w - gap, height: h - gap }, style: { fill } };
  };
}

/**
 * Stacked fail map: every die position a rectangle in true aspect, coloured by its fail rate over the stacked
 * wafers on a fixed 0–100 % cividis scale, over the wafer disc with the usable ring and notch as on the wafer
 * map. A tooltip per position gives the rate and "fails of tested" wafers. The box exposes `data-cell-count`.
 */
export function RateMap({ cells, geometry, ariaLabel }: RateMapProps) {
  const option = useMemo(() => {
    const layout = mapLayout(cells, geometry);
    const half = layout.viewHalfSideMm;
    const axis = { type: "value" as const, min: -half, max: half, show: false };
    const data = cells.map((c, i) => {
      const r = layout.rects[i];
      return [r?.centreXMm ?? 0, r?.centreYMm ?? 0, 100 * c.failRate, i];
    });
    const outline = (id: string, renderItem: CustomSeriesRenderItem, z: number): CustomSeriesOption => ({
      type: "custom", id, data: [[0, 0]], renderItem, silent: true, z, tooltip: { show: false },
    });
    return {
      animation: false,
      textStyle: TEXT_STYLE,
      grid: { left: "2%", top: "2%", width: "76.8%", height: "96%", containLabel: false },
      xAxis: axis,
      yAxis: axis,
      tooltip: {
        ...TOOLTIP_STYLE,
        trigger: "item",
        confine: true,
        formatter: (params: unknown) => {
          const value = (params as { value?: unknown }).value;
          const cell = Array.isArray(value) ? cells[Number(value[DIM.index])] : undefined;
          if (!cell) return "";
          return tooltipHtml(`Die (${cell.x}, ${cell.y})`, [
            { label: "Fail rate", value: `${(100 * cell.failRate).toFixed(1)} %` },
            { label: "Failing wafers", value: `${cell.fails} of ${cell.tested}` },
          ]);
        },
      },
      visualMap: [
        {
          type: "continuous",
          min: 0,
          max: 100,
          seriesIndex: [],
          calculable: false,
          hoverLink: false,
          inRange: { color: [...CIVIDIS_STOPS] },
          orient: "vertical",
          left: "82.5%",
          top: 44,
          itemWidth: 14,
          itemHeight: 180,
          text: ["100 %", "0 %"],
          textStyle: { ...TEXT_STYLE, color: INK_SOFT },
        },
      ],
      graphic: [{ type: "text", left: "80.5%", top: 12, style: { text: "Fail rate (%)", fill: TEXT_STYLE.color, font: `600 12px ${TEXT_STYLE.fontFamily}` } }],
      series: [
        outline("wafer-disc", waferDiscRenderer(layout), 1),
        { type: "custom", id: "cells", name: "Fail rate", data, renderItem: cellRenderer(layout.dieWidthMm, layout.dieHeightMm), encode: { x: DIM.xMm, y: DIM.yMm }, clip: true, z: 2 },
        outline("wafer-marks", waferMarksRenderer(layout), 3),
      ],
    };
  }, [cells, geometry]);
  return (
    <div role="img" aria-label={ariaLabel} data-cell-count={cells.length} className="w-full" style={{ aspectRatio: String(LARGE_ASPECT_RATIO) }}>
      <ReactEChartsCore echarts={echarts} option={option} notMerge style={CHART_STYLE} />
    </div>
  );
}
