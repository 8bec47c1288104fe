import type { CustomSeriesOption } from "echarts/charts";
import type {
  DataZoomComponentOption,
  GraphicComponentOption,
  GridComponentOption,
  LegendComponentOption,
  TooltipComponentOption,
  VisualMapComponentOption,
} from "echarts/components";
import type { ComposeOption } from "echarts/core";
import { BIN_COLOURS, BIN_ORDER } from "@/domain/wafer-map/bin-colours";
import { cividis } from "@/domain/wafer-map/cividis";
import type { MapLayout } from "@/domain/wafer-map/layout";
import type { Bin, MapDie } from "@/domain/wafer-map/map-die";
import type { RectPx } from "@/domain/wafer-map/rect-px";
import { scaleConductance, type ConductanceUnit } from "@/domain/wafer-map/units";
import { colourScaleRange, type ValueRange } from "@/domain/wafer-map/value-range";
import { TEXT_STYLE } from "./chart-theme";
import { dieHitTest, NO_PAINT, type PaintCounts } from "@/domain/wafer-map/paint";
import { binLegend, conductanceScale, scaleTitle } from "./wafer-map-labels";
import { dieFieldRenderer, waferDiscRenderer, waferMarksRenderer, type CanvasFactory } from "./wafer-map-render";

export type WaferMapOption = ComposeOption<
  | CustomSeriesOption
  | DataZoomComponentOption
  | GraphicComponentOption
  | GridComponentOption
  | LegendComponentOption
  | TooltipComponentOption
  | VisualMapComponentOption
>;

export type WaferMapColouring = "conductance" | "bin";
export type WaferMapSize = "large" | "small";

export interface WaferMapInput {
  readonly dies: readonly MapDie[];
  readonly layout: MapLayout;
  readonly colourBy: WaferMapColouring;
  readonly unit: ConductanceUnit;
  readonly size: WaferMapSize;
  /** Colour-scale range in S; ignored unless finite with minS < maxS. */
  readonly valueRange?: { readonly minS: number; readonly maxS: number } | null;
  /** Where the die fields are painted; default a new HTML canvas (tests pass a recording stand-in). */
  readonly createCanvas?: CanvasFactory;
}

export interface WaferMapModel {
  readonly option: WaferMapOption;
  readonly dieCount: number;
  /** Out-of-window dies drawn with the ring mark. */
  readonly flaggedCount: number;
  readonly inkedCount: number;
  readonly binCounts: Readonly<Record<Bin, number>>;
  /** Colour-scale range in the display unit; null when colouring by bin or when no die has a conductance. */
  readonly colourRange: ValueRange | null;
  /** Index of the die under a point of the map plane (mm, y up), or null: the hover and click hit test. */
  dieAt(xMm: number, yMm: number): number | null;
  /** What the last paint of every die field drew, summed over the fields not hidden by the legend (names). */
  drawn(hidden?: ReadonlySet<string>): PaintCounts;
}

// Width : height of the large map's box. The square plot takes 96 % of the height and the legend the right
// fifth, so the wafer stays round whatever the width: 0.96 · H = 0.768 · W when W = 1.25 · H.
export const LARGE_ASPECT_RATIO = 1.25;
const PLOT_FRACTIONS: Readonly<Record<WaferMapSize, RectPx>> = {
  large: { x: 0.02, y: 0.02, width: 0.768, height: 0.96 },
  small: { x: 0.02, y: 0.02, width: 0.96, height: 0.96 },
};

/** The plot rectangle in px for a chart of widthPx × heightPx (the grid's left/top/width/height fractions). */
export function plotRectPx(size: WaferMapSize, widthPx: number, heightPx: number): RectPx {
  const f = PLOT_FRACTIONS[size];
  return { x: f.x * widthPx, y: f.y * heightPx, width: f.width * widthPx, height: f.height * heightPx };
}

/** Canvas layer of the selection outline, above the chart, so moving it repaints one rectangle and no die. */
export const OVERLAY_ZLEVEL = 1;

function gridOption(size: WaferMapSize): GridComponentOption {
  const f = PLOT_FRACTIONS[size];
  const percent = (v: number) => `${Number((v * 100).toFixed(3))}%`;
  return { left: percent(f.x), top: percent(f.y), width: percent(f.width), height: percent(f.height), containLabel: false };
}

interface DieGroup {
  readonly id: string;
  readonly name: string;
  readonly bin?: Bin;
  readonly indices: number[];
}

function resolveRange(values: readonly (number | null)[], input: WaferMapInput): ValueRange | null {
  const given = input.valueRange;
  if (given && Number.isFinite(given.minS) && Number.isFinite(given.maxS) && given.minS < given.maxS) {
    const min = scaleConductance(given.minS, input.unit);
    const max = scaleConductance(given.maxS, input.unit);
    if (min !== null && max !== null) return { min, max };
  }
  return colourScaleRange(values);
}

function dieSeries(id: string, name: string, renderItem: CustomSeriesOption["renderItem"], colour?: string): CustomSeriesOption {
  // One data item at the origin: the field paints all of its dies at once (wafer-map-render dieFieldRenderer).
  // Silent, with no tooltip: the map's own pointer handling finds the die under the cursor (dieAt).
  return {
    type: "custom",
    id,
    name,
    data: [[0, 0]],
    renderItem,
    encode: { x: 0, y: 1 },
    clip: true,
    silent: true,
    z: 2,
    tooltip: { show: false },
    ...(colour ? { itemStyle: { color: colour } } : {}),
  };
}

/**
 * The echarts option of a wafer map and the counts the container exposes: one die field per colour group (all
 * dies, or one per bin present in BIN_ORDER, so the bin legend toggles them) over a square cartesian plane in
 * mm, the disc below and the usable ring and notch above, zoom and pan on both axes for the large map, a
 * cividis legend titled with the unit or a bin legend with counts. Empty `dies` draws the bare wafer.
 */
export function buildWaferMap(input: WaferMapInput): WaferMapModel {
  const { dies, layout, colourBy, unit, size } = input;
  const large = size === "large";
  const values = dies.map((d) => scaleConductance(d.conductanceS, unit));
  const colourRange = colourBy === "conductance" ? resolveRange(values, input) : null;
  const span = colourRange ? colourRange.max - colourRange.min : 1;
  const fills = dies.map((d, i) => {
    if (colourBy === "bin") return BIN_COLOURS[d.bin];
    const v = values[i];
    return v === null || v === undefined || colourRange === null ? BIN_COLOURS.NODATA : cividis((v - colourRange.min) / span);
  });
  const binCounts = Object.fromEntries(BIN_ORDER.map((b) => [b, 0])) as Record<Bin, number>;
  for (const d of dies) binCounts[d.bin]++;

  const groups: DieGroup[] =
    colourBy === "bin"
      ? BIN_ORDER.filter((b) => binCounts[b] > 0).map((b) => ({ id: `dies-${b}`, name: b, bin: b, indices: [] }))
      : [{ id: "dies", name: "Dies", indices: [] }];
  dies.forEach((d, i) => {
    const group = colourBy === "bin" ? groups.find((g) => g.bin === d.bin) : groups[0];
    group?.indices.push(i);
  });

  // The disc under the die fields (z 2), the usable ring and notch over them.
  const outline = (id: string, renderItem: CustomSeriesOption["renderItem"], z: number): CustomSeriesOption => ({
    type: "custom", id, data: [[0, 0]], renderItem, silent: true, clip: true, z, tooltip: { show: false },
  });
  const painted = new Map<string, PaintCounts>(); // by series name, the legend's key
  const series: CustomSeriesOption[] = [
    outline("wafer-disc", waferDiscRenderer(layout), 1),
    ...groups.map((g) => {
      const render = dieFieldRenderer(dies, layout, fills, g.indices, (counts) => painted.set(g.name, counts), input.createCanvas);
      return dieSeries(g.id, g.name, render, g.bin ? BIN_COLOURS[g.bin] : undefined);
    }),
    outline("wafer-marks", waferMarksRenderer(layout), 3),
  ];
  const half = layout.viewHalfSideMm;
  const axis = { type: "value" as const, min: -half, max: half, show: false };
  const scale = large && colourRange !== null ? conductanceScale(colourRange, unit) : null;
  const option: WaferMapOption = {
    animation: false,
    textStyle: TEXT_STYLE,
    grid: gridOption(size),
    xAxis: axis,
    yAxis: axis,
    series,
    tooltip: { show: false },
    dataZoom: large
      ? [
          { type: "inside", id: "zoom-x", xAxisIndex: 0, filterMode: "none" },
          { type: "inside", id: "zoom-y", yAxisIndex: 0, filterMode: "none" },
        ]
      : [],
    legend: binLegend(groups.flatMap((g) => (g.bin ? [g.bin] : [])), binCounts, large && colourBy === "bin"),
    visualMap: scale ? [scale] : [],
    graphic: [scaleTitle(unit, scale !== null)],
  };
  return {
    option,
    dieCount: dies.length,
    flaggedCount: dies.filter((d) => d.outOfWindow).length,
    inkedCount: dies.filter((d) => d.inked).length,
    binCounts,
    colourRange,
    dieAt: dieHitTest(dies, layout),
    drawn: (hidden) => {
      let total = NO_PAINT;
      for (const [name, c] of painted) if (!hidden?.has(name)) total = { dies: total.dies + c.dies, rings: total.rings + c.rings, hatched: total.hatched + c.hatched };
      return total;
    },
  };
}
