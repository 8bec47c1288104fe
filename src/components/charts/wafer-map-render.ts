import type {
  CustomSeriesRenderItem,
  CustomSeriesRenderItemAPI,
  CustomSeriesRenderItemParams,
  CustomSeriesRenderItemReturn,
} from "echarts";
import { contrastInk } from "@/domain/wafer-map/cividis";
import { hatchSegments } from "@/domain/wafer-map/hatch";
import type { MapLayout } from "@/domain/wafer-map/layout";
import type { MapDie } from "@/domain/wafer-map/map-die";
import { containsPoint, intersectRect, type RectPx } from "@/domain/wafer-map/rect-px";
import { INK, INK_MUTED, SLATE_WASH } from "./chart-theme";

type Element = NonNullable<CustomSeriesRenderItemReturn>;

/** Index of each value in a die-series data item: [centreXMm, centreYMm, value in unit or null, die index]. */
export const DIE_DIM = { xMm: 0, yMm: 1, value: 2, dieIndex: 3 } as const;

function pixelSize(api: CustomSeriesRenderItemAPI, widthMm: number, heightMm: number): [number, number] {
  const size = api.size?.([widthMm, heightMm]) ?? [0, 0];
  return Array.isArray(size) ? [size[0] ?? 0, size[1] ?? 0] : [size, size];
}

function centrePx(api: CustomSeriesRenderItemAPI, xMm: number, yMm: number): [number, number] {
  const [x = 0, y = 0] = api.coord([xMm, yMm]);
  return [x, y];
}

function plotRect(params: CustomSeriesRenderItemParams): RectPx | null {
  const { x, y, width, height } = params.coordSys as { x?: number; y?: number; width?: number; height?: number };
  return x === undefined || y === undefined || width === undefined || height === undefined ? null : { x, y, width, height };
}

/**
 * Draws one die: a filled rectangle (fills[dieIndex]) with a hairline gap to its neighbours; an inked die adds
 * a diagonal hatch in black or white, whichever contrasts with the fill; an out-of-window die adds a white dot
 * ringed in black at its centre. Both marks read in either colouring and in greyscale (§14). Dies are cut to
 * the plot rectangle here (and skipped outside it) because progressive rendering ignores the series clip.
 */
export function dieRenderer(dies: readonly MapDie[], layout: MapLayout, fills: readonly string[]): CustomSeriesRenderItem {
  return (params, api) => {
    const dieIndex = Number(api.value(DIE_DIM.dieIndex));
    const die = dies[dieIndex];
    if (die === undefined) return null;
    const [cx, cy] = centrePx(api, Number(api.value(DIE_DIM.xMm)), Number(api.value(DIE_DIM.yMm)));
    const [w, h] = pixelSize(api, layout.dieWidthMm, layout.dieHeightMm);
    const gap = Math.min(1, 0.08 * Math.min(w, h));
    const full = { x: cx - w / 2 + gap / 2, y: cy - h / 2 + gap / 2, width: w - gap, height: h - gap };
    const plot = plotRect(params);
    const shape = plot ? intersectRect(full, plot) : full;
    if (shape === null) return null;
    const fill = fills[dieIndex] ?? "#999999";
    const rect: Element = { type: "rect", shape, style: { fill }, autoBatch: true };
    if (!die.inked && !die.outOfWindow) return rect;
    const children: Element[] = [rect];
    if (die.inked) {
      const stroke = contrastInk(fill);
      const spacing = Math.max(2, Math.min(w, h) / 3.5);
      for (const [x1, y1, x2, y2] of hatchSegments(shape.x, shape.y, shape.width, shape.height, spacing)) {
        children.push({ type: "line", shape: { x1, y1, x2, y2 }, style: { stroke, lineWidth: 1 }, autoBatch: true });
      }
    }
    if (die.outOfWindow && (plot === null || containsPoint(plot, cx, cy))) {
      const r = Math.max(1.5, 0.28 * Math.min(w, h));
      children.push({ type: "circle", shape: { cx, cy, r }, style: { fill: "#ffffff", stroke: "#000000", lineWidth: Math.max(1, 0.3 * r) } });
    }
    return { type: "group", children };
  };
}

/** The wafer disc under the dies: outline circle of radius diameter/2, filled with the slate wash. */
export function waferDiscRenderer(layout: MapLayout): CustomSeriesRenderItem {
  return (_params, api) => {
    const [cx, cy] = centrePx(api, 0, 0);
    const [r] = pixelSize(api, layout.waferRadiusMm, layout.waferRadiusMm);
    return { type: "circle", shape: { cx, cy, r }, style: { fill: SLATE_WASH, stroke: INK_MUTED, lineWidth: 1.5 } };
  };
}

/** Marks over the dies: the usable-radius ring (dashed) and the notch at 6 o'clock, filled in ink. */
export function waferMarksRenderer(layout: MapLayout): CustomSeriesRenderItem {
  return (_params, api) => {
    const [cx, cy] = centrePx(api, 0, 0);
    const [r] = pixelSize(api, layout.usableRadiusMm, layout.usableRadiusMm);
    const points = layout.notchMm.map((p) => centrePx(api, p.xMm, p.yMm));
    return {
      type: "group",
      children: [
        { type: "circle", shape: { cx, cy, r }, style: { fill: "none", stroke: INK_MUTED, lineWidth: 1, lineDash: [5, 4] } },
        { type: "polygon", shape: { points }, style: { fill: INK } },
      ],
    };
  };
}
