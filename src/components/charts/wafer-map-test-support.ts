import type { CustomSeriesOption } from "echarts/charts";
import type { CustomSeriesRenderItemAPI, CustomSeriesRenderItemParams, CustomSeriesRenderItemReturn } from "echarts";
import type { MapDie } from "@/domain/wafer-map/map-die";
import type { WaferMapOption } from "./wafer-map-options";
import type { CanvasFactory, FieldCanvas } from "./wafer-map-render";

/** A die with plausible §9 fields; override what a test needs. */
export function testDie(x: number, y: number, overrides: Partial<MapDie> = {}): MapDie {
  return {
    x,
    y,
    conductanceS: 10e-6 + x * 1e-6,
    bin: "PASS",
    outOfWindow: false,
    inked: false,
    modes: null,
    nonlinearity: 0.005,
    r2: 0.9999,
    pointsInWindow: 7,
    windowV: 0.012926,
    temperatureK: 300,
    ...overrides,
  };
}

export const PX_PER_MM = 10;
export const PLOT = { x: 0, y: 0, width: 1000, height: 1000 };

/** A stand-in for the echarts render API: 10 px per mm, origin at (500, 500) px, y up on the map and down on screen. */
function fakeApi(item: readonly number[]): CustomSeriesRenderItemAPI {
  const api = {
    value: (dim: number) => item[dim],
    coord: ([x, y]: number[]) => [500 + (x ?? 0) * PX_PER_MM, 500 - (y ?? 0) * PX_PER_MM],
    size: ([w, h]: number[]) => [(w ?? 0) * PX_PER_MM, (h ?? 0) * PX_PER_MM],
  };
  return api as unknown as CustomSeriesRenderItemAPI;
}

export function seriesList(option: WaferMapOption): CustomSeriesOption[] {
  const series = option.series;
  return (Array.isArray(series) ? series : series ? [series] : []) as CustomSeriesOption[];
}

/** Runs a custom series' renderItem over all its data items, as echarts would, and returns what it drew. */
export function renderSeries(series: CustomSeriesOption, plot = PLOT): CustomSeriesRenderItemReturn[] {
  const data = (series.data ?? []) as number[][];
  const params = { coordSys: { type: "cartesian2d", ...plot } } as unknown as CustomSeriesRenderItemParams;
  return data.map((item) => series.renderItem?.(params, fakeApi(item)));
}

/** What a die field painted, read back from the recording canvas: rectangles, hatch lines and rings, in chart px. */
export interface Painted {
  rects: { x: number; y: number; width: number; height: number; fill: string }[];
  lines: { x1: number; y1: number; x2: number; y2: number; stroke: string }[];
  rings: { cx: number; cy: number; r: number; fill: string; stroke: string }[];
  /** The canvas size in px and the transform set before painting: [a, b, c, d, e, f]. */
  canvas: { width: number; height: number; transform: number[] };
}

/**
 * A canvas factory whose 2D context records the calls the die painter makes (fillRect, paths of moveTo/lineTo
 * and arcs, fill and stroke with the styles current at the time); `painted` accumulates over every canvas made.
 */
export function recordingCanvas(): { factory: CanvasFactory; painted: Painted } {
  const painted: Painted = { rects: [], lines: [], rings: [], canvas: { width: 0, height: 0, transform: [] } };
  const factory: CanvasFactory = () => {
    let segments: [number, number, number, number][] = [];
    let arcs: { cx: number; cy: number; r: number; fill: string }[] = [];
    let at: [number, number] = [0, 0];
    const canvas: FieldCanvas = {
      width: 0,
      height: 0,
      getContext: () => ctx,
    };
    const ctx = {
      fillStyle: "" as unknown,
      strokeStyle: "" as unknown,
      lineWidth: 1,
      setTransform: (...m: number[]) => {
        painted.canvas = { width: canvas.width, height: canvas.height, transform: m };
      },
      fillRect: (x: number, y: number, width: number, height: number) => painted.rects.push({ x, y, width, height, fill: String(ctx.fillStyle) }),
      beginPath: () => {
        segments = [];
        arcs = [];
      },
      moveTo: (x: number, y: number) => {
        at = [x, y];
      },
      lineTo: (x: number, y: number) => {
        segments.push([at[0], at[1], x, y]);
        at = [x, y];
      },
      arc: (cx: number, cy: number, r: number) => arcs.push({ cx, cy, r, fill: "" }),
      fill: () => {
        for (const a of arcs) a.fill = String(ctx.fillStyle);
      },
      stroke: () => {
        for (const [x1, y1, x2, y2] of segments) painted.lines.push({ x1, y1, x2, y2, stroke: String(ctx.strokeStyle) });
        for (const a of arcs) painted.rings.push({ ...a, stroke: String(ctx.strokeStyle) });
      },
    };
    return canvas;
  };
  return { factory, painted };
}

type Drawn = { type?: string; children?: Drawn[]; shape?: Record<string, unknown>; style?: Record<string, unknown> };

/** Every element in a drawn tree, groups flattened. */
export function flatten(drawn: readonly CustomSeriesRenderItemReturn[]): Drawn[] {
  const out: Drawn[] = [];
  const walk = (el: Drawn) => {
    out.push(el);
    el.children?.forEach(walk);
  };
  drawn.forEach((el) => el && walk(el as Drawn));
  return out;
}
