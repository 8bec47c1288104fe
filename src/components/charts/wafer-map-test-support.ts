import type { CustomSeriesOption } from "echarts/charts";
import type { CustomSeriesRenderItemAPI, CustomSeriesRenderItemParams, CustomSeriesRenderItemReturn } from "echarts";
import type { MapDie } from "@/domain/wafer-map/map-die";
import type { WaferMapOption } from "./wafer-map-options";

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
