import { describe, expect, it } from "vitest";
import { mapLayout } from "./layout";
import type { MapDie } from "./map-die";
import { dieHitTest, paintDies, type PaintContext } from "./paint";

const geometry = { dieWidthMm: 5, dieHeightMm: 5, waferDiameterMm: 100, edgeExclusionMm: 3 };
const die = (x: number, y: number, extra: Partial<MapDie> = {}): MapDie => ({
  x, y, conductanceS: 1e-5, bin: "PASS", outOfWindow: false, inked: false, modes: null, nonlinearity: 0, r2: 1, pointsInWindow: 7, windowV: 0.013, temperatureK: 300, ...extra,
});

function counter(): PaintContext & { calls: Record<string, number> } {
  const calls: Record<string, number> = {};
  const count = (name: string) => () => {
    calls[name] = (calls[name] ?? 0) + 1;
  };
  return {
    calls, fillStyle: "", strokeStyle: "", lineWidth: 1,
    fillRect: count("fillRect"), beginPath: count("beginPath"), moveTo: count("moveTo"), lineTo: count("lineTo"), arc: count("arc"), fill: count("fill"), stroke: count("stroke"),
  };
}

describe("dieHitTest", () => {
  it("finds dies on a grid whose centre falls between dies (even count), cell edges at the half pitch", () => {
    // x 0..3, y 0..1: centre (1.5, 0.5); die (2, 1) is centred at (2.5, 2.5) mm and owns 0..5 × 0..5 mm
    const dies = [0, 1, 2, 3].flatMap((x) => [die(x, 0), die(x, 1)]);
    const at = dieHitTest(dies, mapLayout(dies, geometry));
    expect(at(2.5, 2.5)).toBe(5);
    expect(at(0.01, 4.99)).toBe(5);
    expect(at(-0.01, 2.5)).toBe(3); // die (1, 1)
    expect(at(2.5, -0.01)).toBe(4); // die (2, 0)
    expect(at(10.01, 0)).toBeNull();
  });

  it("answers the first die at a repeated grid position", () => {
    const dies = [die(0, 0), die(0, 0, { bin: "LOW" })];
    expect(dieHitTest(dies, mapLayout(dies, geometry))(0, 0)).toBe(0);
  });
});

describe("paintDies", () => {
  const dies = [die(0, 0, { outOfWindow: true }), die(1, 0, { inked: true }), die(2, 0)];
  const layout = mapLayout(dies, geometry);
  const view = { originX: 100, originY: 100, pxPerMmX: 2, pxPerMmY: 2 };
  const plot = { x: 0, y: 0, width: 200, height: 200 };

  it("batches by colour: one fillStyle per fill, one path for the hatches and one for the rings", () => {
    const ctx = counter();
    const counts = paintDies(ctx, dies, layout, ["#111111", "#111111", "#222222"], [0, 1, 2], view, plot);
    expect(counts).toEqual({ dies: 3, rings: 1, hatched: 1 });
    expect(ctx.calls.fillRect).toBe(3);
    expect(ctx.calls.arc).toBe(1);
    expect(ctx.calls.beginPath).toBe(2); // hatches (one ink) + rings
  });

  it("paints only the listed dies, and nothing for a degenerate view", () => {
    expect(paintDies(counter(), dies, layout, [], [2], view, plot)).toEqual({ dies: 1, rings: 0, hatched: 0 });
    expect(paintDies(counter(), dies, layout, [], [0, 1, 2], { ...view, pxPerMmX: 0 }, plot).dies).toBe(0);
  });
});
