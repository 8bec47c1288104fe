import { describe, expect, it } from "vitest";
import { BIN_COLOURS } from "@/domain/wafer-map/bin-colours";
import { cividis } from "@/domain/wafer-map/cividis";
import { mapLayout } from "@/domain/wafer-map/layout";
import type { MapDie } from "@/domain/wafer-map/map-die";
import { CONDUCTANCE_QUANTUM_S } from "@/domain/transport/constants";
import { buildWaferMap, LARGE_ASPECT_RATIO, plotRectPx, type WaferMapInput } from "./wafer-map-options";
import { dieTooltipHtml } from "./wafer-map-labels";
import { flatten, PX_PER_MM, recordingCanvas, renderSeries, seriesList, testDie } from "./wafer-map-test-support";

// 4 mm × 2 mm dies on a 100 mm wafer; a 3 × 3 grid centred on (1, 1).
const geometry = { dieWidthMm: 4, dieHeightMm: 2, waferDiameterMm: 100, edgeExclusionMm: 3 };
const dies: MapDie[] = [
  testDie(0, 0, { outOfWindow: true }),
  testDie(1, 0, { inked: true }),
  testDie(2, 0, { outOfWindow: true, inked: true, bin: "HIGH" }),
  testDie(0, 1, { bin: "LOW" }),
  testDie(1, 1),
  testDie(2, 1, { bin: "NODATA", conductanceS: null }),
  testDie(0, 2),
  testDie(1, 2, { bin: "LOW" }),
  testDie(2, 2),
];

function build(overrides: Partial<WaferMapInput> = {}) {
  const input = { dies, layout: mapLayout(dies, geometry), colourBy: "conductance" as const, unit: "µS" as const, size: "large" as const, ...overrides };
  return buildWaferMap(input);
}

/** Builds the map on a recording canvas and paints every die field once, as echarts would, into `plot`. */
function paint(overrides: Partial<WaferMapInput> = {}, plot?: { x: number; y: number; width: number; height: number }) {
  const { factory, painted } = recordingCanvas();
  const model = build({ createCanvas: factory, ...overrides });
  const elements = dieSeries(model).flatMap((s) => flatten(renderSeries(s, plot)));
  return { model, painted, elements };
}

function dieSeries(model: ReturnType<typeof build>) {
  return seriesList(model.option).filter((s) => String(s.id).startsWith("dies"));
}

function onlyDieSeries(model: ReturnType<typeof build>) {
  const [series, ...rest] = dieSeries(model);
  if (series === undefined || rest.length > 0) throw new Error("expected one die series");
  return series;
}

describe("buildWaferMap counts", () => {
  it("counts the dies and the out-of-window dies it flags", () => {
    const model = build();
    expect(model.dieCount).toBe(9);
    expect(model.flaggedCount).toBe(2);
    expect(model.inkedCount).toBe(2);
    expect(model.binCounts).toMatchObject({ PASS: 5, LOW: 2, HIGH: 1, NODATA: 1, OPEN: 0 });
  });
});

describe("die drawing", () => {
  const { model, painted, elements } = paint();

  it("hands echarts one image per die field, covering the plot", () => {
    expect(elements).toHaveLength(1);
    expect(elements[0]).toMatchObject({ type: "image", style: { x: 0, y: 0, width: 1000, height: 1000 } });
    // painted at twice the plot's size at least (screen pixel ratio, and the 2× PNG export), plot corner at 0, 0
    expect(painted.canvas.width).toBeGreaterThanOrEqual(2000);
    expect(painted.canvas.transform).toEqual([2, 0, 0, 2, -0, -0]);
  });

  it("rings exactly the out-of-window dies with a white dot outlined in black, and reports the rings it drew", () => {
    expect(painted.rings).toHaveLength(2);
    for (const ring of painted.rings) expect(ring).toMatchObject({ fill: "#ffffff", stroke: "#000000" });
    // dies (0, 0) and (2, 0): centres −4 and +4 mm, 2 mm below the centre row → (460, 520) and (540, 520) px
    expect(painted.rings.map((r) => [r.cx, r.cy])).toEqual([[460, 520], [540, 520]]);
    expect(model.drawn().rings).toBe(model.flaggedCount);
  });

  it("hatches the inked dies only, inside their rectangles", () => {
    expect(model.drawn().hatched).toBe(2);
    expect(painted.lines.length).toBeGreaterThan(0);
    // inked dies (1, 0) and (2, 0) span x 480–520 and 520–560 px, y 510–530 px
    for (const l of painted.lines) {
      expect(Math.min(l.x1, l.x2)).toBeGreaterThanOrEqual(480);
      expect(Math.min(l.y1, l.y2)).toBeGreaterThanOrEqual(510);
      expect(Math.max(l.y1, l.y2)).toBeLessThanOrEqual(530);
    }
  });

  it("draws each die in its true aspect ratio, less a hairline gap", () => {
    expect(painted.rects).toHaveLength(9);
    for (const rect of painted.rects) {
      // 40 × 20 px at 10 px/mm, minus the 1 px gap in each direction
      expect(rect.width).toBeCloseTo(4 * PX_PER_MM - 1, 9);
      expect(rect.height).toBeCloseTo(2 * PX_PER_MM - 1, 9);
    }
  });

  it("colours by cividis over the colour range and draws a missing conductance grey", () => {
    const range = model.colourRange;
    expect(range).not.toBeNull();
    const fills = painted.rects.map((r) => r.fill);
    expect(fills).toContain(BIN_COLOURS.NODATA);
    // die (1, 1) has G = 11 µS and sits at the centre: 480–520 × 490–510 px less the gap
    const t = (11 - (range?.min ?? 0)) / ((range?.max ?? 1) - (range?.min ?? 0));
    expect(painted.rects.find((r) => r.x === 480.5 && r.y === 490.5)?.fill).toBe(cividis(t));
  });

  it("skips dies outside the plot and cuts those straddling its edge", () => {
    // dies centred at x = −4, 0, 4 mm → 460, 500, 540 px; a plot ending at 500 px keeps the left half
    const cut = paint({}, { x: 0, y: 0, width: 500, height: 1000 });
    expect(cut.painted.rects).toHaveLength(6);
    for (const rect of cut.painted.rects) expect(rect.x + rect.width).toBeLessThanOrEqual(500);
    // the ring of die (2, 0) at 540 px is off the plot; die (0, 0)'s stays
    expect(cut.model.drawn().rings).toBe(1);
  });

  it("repaints only when the view changes", () => {
    const { factory, painted: again } = recordingCanvas();
    const [series] = dieSeries(build({ createCanvas: factory }));
    renderSeries(series!);
    renderSeries(series!);
    expect(again.rects).toHaveLength(9);
    renderSeries(series!, { x: 0, y: 0, width: 800, height: 800 });
    expect(again.rects).toHaveLength(18);
  });
});

describe("hit test", () => {
  it("finds the die whose cell holds a point of the map plane, and nothing off the grid", () => {
    const model = build();
    // the grid centre (1, 1) is at the origin; dies are 4 × 2 mm
    expect(model.dieAt(0, 0)).toBe(4);
    expect(model.dieAt(-4, -2)).toBe(0); // die (0, 0)
    expect(model.dieAt(5.9, 2.9)).toBe(8); // die (2, 2), near its corner
    expect(model.dieAt(6.1, 0)).toBeNull();
    expect(model.dieAt(Number.NaN, 0)).toBeNull();
  });
});

describe("legends", () => {
  it("labels the cividis legend with values and the unit, titled G (µS)", () => {
    const model = build();
    const [scale] = model.option.visualMap as { text: string[]; min: number; max: number }[];
    expect(scale?.min).toBe(model.colourRange?.min);
    expect(scale?.text[0]).toMatch(/ µS$/);
    const [title] = model.option.graphic as { style: { text: string }; invisible: boolean }[];
    expect(title?.style.text).toBe("G (µS)");
    expect(title?.invisible).toBe(false);
  });

  it("converts a value range given in S into the display unit", () => {
    const model = build({ unit: "G0", valueRange: { minS: CONDUCTANCE_QUANTUM_S, maxS: 3 * CONDUCTANCE_QUANTUM_S } });
    expect(model.colourRange?.min).toBeCloseTo(1, 12);
    expect(model.colourRange?.max).toBeCloseTo(3, 12);
    const [title] = model.option.graphic as { style: { text: string } }[];
    expect(title?.style.text).toBe("G/G₀");
  });

  it("colours by bin with one series per bin present, in the bin colour, and counts in the legend", () => {
    const model = build({ colourBy: "bin" });
    const series = dieSeries(model);
    expect(series.map((s) => s.name)).toEqual(["PASS", "LOW", "HIGH", "NODATA"]);
    expect(series.map((s) => (s.itemStyle as { color: string }).color)).toEqual(["PASS", "LOW", "HIGH", "NODATA"].map((b) => BIN_COLOURS[b as "PASS"]));
    const legend = model.option.legend as { show: boolean; formatter: (name: string) => string };
    expect(legend.show).toBe(true);
    expect(legend.formatter("LOW")).toBe("LOW  2");
    expect(model.option.visualMap).toEqual([]);
  });

  it("paints each bin's dies in its own field, in the bin colour, and leaves a hidden bin out of the counts", () => {
    const { model, painted } = paint({ colourBy: "bin" });
    expect(painted.rects.filter((r) => r.fill === BIN_COLOURS.LOW)).toHaveLength(2);
    expect(painted.rects.filter((r) => r.fill === BIN_COLOURS.PASS)).toHaveLength(5);
    expect(model.drawn().rings).toBe(2);
    // die (2, 0) is HIGH and out of window; hiding HIGH leaves die (0, 0)'s ring
    expect(model.drawn(new Set(["HIGH"])).rings).toBe(1);
  });
});

describe("small thumbnails", () => {
  it("draw no legend, scale, tooltip or zoom, and ignore the pointer", () => {
    const model = build({ size: "small" });
    expect(model.option.visualMap).toEqual([]);
    expect((model.option.tooltip as { show: boolean }).show).toBe(false);
    expect(model.option.dataZoom).toEqual([]);
    expect(dieSeries(model).every((s) => s.silent === true)).toBe(true);
    expect(paint({ size: "small" }).painted.rects).toHaveLength(9);
  });
});

describe("tooltip", () => {
  it("describes a die with G in the unit and its flags", () => {
    const html = dieTooltipHtml(dies[4]!, "µS");
    expect(html).toContain("(1, 1)");
    expect(html).toContain("11 µS");
    expect(dieTooltipHtml(dies[0]!, "µS")).toContain("out of window");
  });
});

describe("plotRectPx", () => {
  it("keeps the large plot square in a box of the large aspect ratio, so the wafer stays round", () => {
    const plot = plotRectPx("large", 500 * LARGE_ASPECT_RATIO, 500);
    expect(plot.width).toBeCloseTo(plot.height, 9);
    const small = plotRectPx("small", 120, 120);
    expect(small.width).toBeCloseTo(small.height, 9);
  });
});
