import { describe, expect, it } from "vitest";
import { BIN_COLOURS } from "@/domain/wafer-map/bin-colours";
import { cividis } from "@/domain/wafer-map/cividis";
import { mapLayout } from "@/domain/wafer-map/layout";
import type { MapDie } from "@/domain/wafer-map/map-die";
import { CONDUCTANCE_QUANTUM_S } from "@/domain/transport/constants";
import { buildWaferMap, LARGE_ASPECT_RATIO, plotRectPx, type WaferMapInput } from "./wafer-map-options";
import { flatten, PX_PER_MM, renderSeries, seriesList, testDie } from "./wafer-map-test-support";

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
  const drawn = dieSeries(build()).flatMap((s) => renderSeries(s));
  const elements = flatten(drawn);

  it("rings exactly the out-of-window dies with a white dot outlined in black", () => {
    const rings = elements.filter((e) => e.type === "circle");
    expect(rings).toHaveLength(build().flaggedCount);
    for (const ring of rings) expect(ring.style).toMatchObject({ fill: "#ffffff", stroke: "#000000" });
  });

  it("hatches the inked dies only", () => {
    const hatched = drawn.filter((d) => flatten([d]).some((e) => e.type === "line"));
    expect(hatched).toHaveLength(2);
  });

  it("draws each die in its true aspect ratio, less a hairline gap", () => {
    const rects = elements.filter((e) => e.type === "rect");
    expect(rects).toHaveLength(9);
    for (const rect of rects) {
      const { width, height } = rect.shape as { width: number; height: number };
      // 40 × 20 px at 10 px/mm, minus the 1 px gap in each direction
      expect(width).toBeCloseTo(4 * PX_PER_MM - 1, 9);
      expect(height).toBeCloseTo(2 * PX_PER_MM - 1, 9);
    }
  });

  it("colours by cividis over the colour range and draws a missing conductance grey", () => {
    const model = build();
    const range = model.colourRange;
    expect(range).not.toBeNull();
    const fills = flatten(renderSeries(onlyDieSeries(model))).filter((e) => e.type === "rect").map((e) => e.style?.fill);
    expect(fills).toContain(BIN_COLOURS.NODATA);
    // die (1, 1) has G = 11 µS
    const t = (11 - (range?.min ?? 0)) / ((range?.max ?? 1) - (range?.min ?? 0));
    expect(fills).toContain(cividis(t));
  });

  it("skips dies outside the plot and cuts those straddling its edge", () => {
    // dies centred at x = −4, 0, 4 mm → 460, 500, 540 px; a plot ending at 500 px keeps the left half
    const cut = flatten(renderSeries(onlyDieSeries(build()), { x: 0, y: 0, width: 500, height: 1000 })).filter((e) => e.type === "rect");
    expect(cut).toHaveLength(6);
    for (const rect of cut) expect((rect.shape as { x: number; width: number }).x + (rect.shape as { width: number }).width).toBeLessThanOrEqual(500);
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

  it("locates a die in its bin series", () => {
    const model = build({ colourBy: "bin" });
    // series 0 is the wafer disc; LOW is the second bin series; die 7 is the second LOW die
    expect(model.locate(7)).toEqual({ seriesIndex: 2, dataIndex: 1 });
    expect(model.locate(99)).toBeNull();
  });
});

describe("small thumbnails", () => {
  it("draw no legend, scale, tooltip or zoom, and ignore the pointer", () => {
    const model = build({ size: "small" });
    expect(model.option.visualMap).toEqual([]);
    expect((model.option.tooltip as { show: boolean }).show).toBe(false);
    expect(model.option.dataZoom).toEqual([]);
    expect(dieSeries(model).every((s) => s.silent === true)).toBe(true);
  });
});

describe("tooltip", () => {
  it("describes the hovered die with G in the unit, and nothing for an item that is not a die", () => {
    const formatter = (build().option.tooltip as { formatter: (p: unknown) => string }).formatter;
    const html = formatter({ value: [0, 0, 11, 4] });
    expect(html).toContain("(1, 1)");
    expect(html).toContain("11 µS");
    expect(formatter({ value: "not a die" })).toBe("");
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
