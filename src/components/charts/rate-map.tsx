"use client";

import type { CustomSeriesOption } from "echarts/charts";
import type { CustomSeriesRenderItem } from "echarts";
import type { EChartsType } from "echarts/core";
import { useCallback, useEffect, useMemo, useRef } from "react";
import { dieHitTest } from "@/domain/wafer-map/paint";
import { CIVIDIS_STOPS, cividis } from "@/domain/wafer-map/cividis";
import { mapLayout } from "@/domain/wafer-map/layout";
import type { MapGeometry } from "@/domain/wafer-map/map-die";
import type { StackedCell } from "@/domain/yield/spatial-yield";
import { INK_SOFT, TEXT_STYLE, TOOLTIP_BOX_CLASS, tooltipHtml } from "./chart-theme";
import { attachFieldPointer, placeTooltip, type FieldPointer } from "./field-pointer";
import { echarts } from "./echarts-setup";
import { ReactEChartsCore } from "./react-echarts";
import { LARGE_ASPECT_RATIO, plotRectPx } from "./wafer-map-options";
import { dieFieldRenderer, waferDiscRenderer, waferMarksRenderer } from "./wafer-map-render";

export interface RateMapProps {
  /** One cell per die position, as `stackedFailMap` (domain/yield) returns them. */
  cells: readonly StackedCell[];
  geometry: MapGeometry;
  ariaLabel: string;
}

const CHART_STYLE = { width: "100%", height: "100%" };
const NO_PAINT_REPORT = () => undefined;

/**
 * Stacked fail map: every die position a rectangle in true aspect, coloured by its fail rate over the stacked
 * wafers on a fixed 0–100 % cividis scale, over the wafer disc with the usable ring and notch as on the wafer
 * map. The cells are painted as one raster (as the wafer map's dies are); a tooltip per position gives the rate
 * and "fails of tested" wafers. The box exposes `data-cell-count`.
 */
export function RateMap({ cells, geometry, ariaLabel }: RateMapProps) {
  const boxRef = useRef<HTMLDivElement>(null);
  const tipRef = useRef<HTMLDivElement>(null);
  const { option, pointer } = useMemo(() => {
    const layout = mapLayout(cells, geometry);
    const tag = Math.random().toString(36).slice(2);
    const cellAt = dieHitTest(cells, layout);
    const pointer: FieldPointer = {
      dieAt: cellAt,
      hover: (index, x, y) => {
        const cell = index === null ? undefined : cells[index];
        if (!tipRef.current || !boxRef.current) return;
        placeTooltip(tipRef.current, boxRef.current, x, y, cell ? `${tag}:${index}` : null, () =>
          cell
            ? tooltipHtml(`Die (${cell.x}, ${cell.y})`, [
                { label: "Fail rate", value: `${(100 * cell.failRate).toFixed(1)} %` },
                { label: "Failing wafers", value: `${cell.fails} of ${cell.tested}` },
              ])
            : "",
        );
      },
    };
    const fills = cells.map((c) => cividis(c.failRate));
    const indices = cells.map((_, i) => i);
    const half = layout.viewHalfSideMm;
    const axis = { type: "value" as const, min: -half, max: half, show: false };
    const outline = (id: string, renderItem: CustomSeriesRenderItem, z: number): CustomSeriesOption => ({
      type: "custom", id, data: [[0, 0]], renderItem, silent: true, z, tooltip: { show: false },
    });
    const option = {
      animation: false,
      textStyle: TEXT_STYLE,
      grid: { left: "2%", top: "2%", width: "76.8%", height: "96%", containLabel: false },
      xAxis: axis,
      yAxis: axis,
      tooltip: { show: false },
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
        {
          type: "custom", id: "cells", name: "Fail rate", data: [[0, 0]], encode: { x: 0, y: 1 }, clip: true, silent: true, z: 2, tooltip: { show: false },
          renderItem: dieFieldRenderer(cells, layout, fills, indices, NO_PAINT_REPORT),
        },
        outline("wafer-marks", waferMarksRenderer(layout), 3),
      ],
    };
    return { option, pointer };
  }, [cells, geometry]);
  const latest = useRef(pointer);
  useEffect(() => {
    latest.current = pointer;
  });
  const onReady = useCallback((instance: EChartsType) => attachFieldPointer(instance, (w, h) => plotRectPx("large", w, h), () => latest.current), []);
  return (
    <div ref={boxRef} role="img" aria-label={ariaLabel} data-cell-count={cells.length} className="relative w-full" style={{ aspectRatio: String(LARGE_ASPECT_RATIO) }}>
      <ReactEChartsCore echarts={echarts} option={option} notMerge onChartReady={onReady} style={CHART_STYLE} />
      <div ref={tipRef} role="tooltip" hidden className={`pointer-events-none absolute left-0 top-0 z-10 ${TOOLTIP_BOX_CLASS}`} />
    </div>
  );
}
