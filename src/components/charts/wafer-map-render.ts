import type {
  CustomSeriesRenderItem,
  CustomSeriesRenderItemAPI,
  CustomSeriesRenderItemParams,
} from "echarts";
import type { MapLayout } from "@/domain/wafer-map/layout";
import { paintDies, type MmToPx, type PaintContext, type PaintCounts, type PaintedDie } from "@/domain/wafer-map/paint";
import type { RectPx } from "@/domain/wafer-map/rect-px";
import { INK, INK_MUTED, SLATE_WASH } from "./chart-theme";

function pixelSize(api: CustomSeriesRenderItemAPI, widthMm: number, heightMm: number): [number, number] {
  const size = api.size?.([widthMm, heightMm]) ?? [0, 0];
  return Array.isArray(size) ? [size[0] ?? 0, size[1] ?? 0] : [size, size];
}

function centrePx(api: CustomSeriesRenderItemAPI, xMm: number, yMm: number): [number, number] {
  const [x = 0, y = 0] = api.coord([xMm, yMm]);
  return [x, y];
}

/** A canvas the die field paints into: an HTMLCanvasElement in the browser, a recording stand-in in tests. */
export interface FieldCanvas {
  width: number;
  height: number;
  getContext(kind: "2d"): (PaintContext & { setTransform(a: number, b: number, c: number, d: number, e: number, f: number): void }) | null;
}
export type CanvasFactory = () => FieldCanvas;

const browserCanvas: CanvasFactory = () => document.createElement("canvas");

/** Raster scale of the die field: the screen's pixel ratio, at least 2 so the PNG export (2×) stays sharp. */
function rasterScale(): number {
  const dpr = typeof window === "undefined" ? 1 : window.devicePixelRatio || 1;
  return Math.max(2, dpr);
}

function plotRect(params: CustomSeriesRenderItemParams): RectPx | null {
  const { x, y, width, height } = params.coordSys as { x?: number; y?: number; width?: number; height?: number };
  return x === undefined || y === undefined || width === undefined || height === undefined ? null : { x, y, width, height };
}

/** The current mm → px mapping of the cartesian plane, read from two points of the render API. */
function mmToPx(api: CustomSeriesRenderItemAPI): MmToPx {
  const [x0, y0] = centrePx(api, 0, 0);
  const [x1, y1] = centrePx(api, 1, 1);
  return { originX: x0, originY: y0, pxPerMmX: x1 - x0, pxPerMmY: y0 - y1 };
}

/**
 * A die field: the dies listed in `indices`, painted by `paintDies` into an offscreen canvas the size of the plot
 * and returned as one image element, so a zoom, a pan or a resize repaints a raster instead of re-laying
 * thousands of chart elements. The canvas is reused while the view is unchanged. `onPaint` receives what each
 * paint drew (the container exposes the ring count).
 */
export function dieFieldRenderer(
  dies: readonly PaintedDie[],
  layout: MapLayout,
  fills: readonly string[],
  indices: readonly number[],
  onPaint: (counts: PaintCounts) => void,
  createCanvas: CanvasFactory = browserCanvas,
): CustomSeriesRenderItem {
  let cache: { key: string; canvas: FieldCanvas } | null = null;
  return (params, api) => {
    const plot = plotRect(params);
    if (plot === null || !(plot.width > 0 && plot.height > 0)) return null;
    const view = mmToPx(api);
    const scale = rasterScale();
    const key = [plot.x, plot.y, plot.width, plot.height, view.originX, view.originY, view.pxPerMmX, view.pxPerMmY, scale].map((v) => v.toFixed(3)).join();
    if (cache?.key !== key) {
      const canvas = createCanvas();
      canvas.width = Math.max(1, Math.ceil(plot.width * scale));
      canvas.height = Math.max(1, Math.ceil(plot.height * scale));
      const ctx = canvas.getContext("2d");
      if (ctx === null) return null;
      // chart px → canvas px: the canvas's top-left corner is the plot's
      ctx.setTransform(scale, 0, 0, scale, -plot.x * scale, -plot.y * scale);
      onPaint(paintDies(ctx, dies, layout, fills, indices, view, plot));
      cache = { key, canvas };
    }
    return { type: "image", silent: true, style: { image: cache.canvas as unknown as HTMLCanvasElement, x: plot.x, y: plot.y, width: plot.width, height: plot.height } };
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
