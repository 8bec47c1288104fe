import { describe, expect, it } from "vitest";
import { gridCentre } from "../yield/geometry";
import { mapLayout, type DieRectMm, type MapLayout } from "./layout";

// 4 mm wide × 2 mm high dies on a 100 mm wafer with 3 mm edge exclusion: R = 50 mm, usable 47 mm.
const geometry = { dieWidthMm: 4, dieHeightMm: 2, waferDiameterMm: 100, edgeExclusionMm: 3 };
// A 3 × 2 grid: x 0..2, y 0..1, so the centre of the probed extents is (1, 0.5).
const grid = [0, 1, 2].flatMap((x) => [0, 1].map((y) => ({ x, y })));

function rectAt(layout: MapLayout, index: number): DieRectMm {
  const rect = layout.rects[index];
  if (rect === undefined) throw new Error(`no rectangle ${index}`);
  return rect;
}

describe("mapLayout", () => {
  it("places a small grid with the wafer centre at the middle of the probed extents", () => {
    const layout = mapLayout(grid, geometry);
    expect(layout.centre).toEqual({ x: 1, y: 0.5 });
    const corner = layout.rects[0];
    // die (0, 0): centre ((0 − 1)·4, (0 − 0.5)·2) = (−4, −1), so left = −6, bottom = −2
    expect(corner).toEqual({ centreXMm: -4, centreYMm: -1, leftMm: -6, bottomMm: -2, widthMm: 4, heightMm: 2 });
    const far = layout.rects[5];
    expect(far?.centreXMm).toBe(4);
    expect(far?.centreYMm).toBe(1);
  });

  it("keeps the real die aspect ratio and tiles neighbours edge to edge", () => {
    const layout = mapLayout(grid, geometry);
    for (const rect of layout.rects) expect(rect.widthMm / rect.heightMm).toBe(2);
    const [d00, d01, d10] = [rectAt(layout, 0), rectAt(layout, 1), rectAt(layout, 2)];
    expect(d10.leftMm).toBeCloseTo(d00.leftMm + d00.widthMm, 12);
    expect(d01.bottomMm).toBeCloseTo(d00.bottomMm + d00.heightMm, 12);
  });

  it("uses the yield geometry centre convention, so a partly probed wafer shifts the centre", () => {
    const partial = [{ x: 2, y: 0 }, { x: 11, y: -3 }, { x: 4, y: 5 }];
    const layout = mapLayout(partial, geometry);
    expect(layout.centre).toEqual(gridCentre(partial));
    // x spans 2..11 → 6.5; die x = 2 sits (2 − 6.5)·4 = −18 mm left of centre
    expect(layout.rects[0]?.centreXMm).toBe(-18);
  });

  it("draws die_y upward, with the notch at 6 o'clock on the outline", () => {
    const layout = mapLayout(grid, geometry);
    expect(rectAt(layout, 1).centreYMm).toBeGreaterThan(rectAt(layout, 0).centreYMm);
    const [left, tip, right] = layout.notchMm;
    expect(tip.xMm).toBe(0);
    expect(tip.yMm).toBeLessThan(0);
    expect(tip.yMm).toBeGreaterThan(-layout.waferRadiusMm);
    expect(Math.hypot(left.xMm, left.yMm)).toBeCloseTo(layout.waferRadiusMm, 9);
    expect(Math.hypot(right.xMm, right.yMm)).toBeCloseTo(layout.waferRadiusMm, 9);
    expect(left.xMm).toBe(-right.xMm);
  });

  it("gives the outline radius as diameter / 2 and the usable radius less the edge exclusion", () => {
    const layout = mapLayout(grid, geometry);
    expect(layout.waferRadiusMm).toBe(50);
    expect(layout.usableRadiusMm).toBe(47);
    expect(layout.viewHalfSideMm).toBeGreaterThan(50);
  });

  it("widens the view to hold dies that reach past the outline", () => {
    // x spans −20..20 with 4 mm dies: the outer die edge is at 20·4 + 2 = 82 mm, beyond R = 50 mm
    const wide = mapLayout([{ x: -20, y: 0 }, { x: 20, y: 0 }], geometry);
    expect(wide.viewHalfSideMm).toBeGreaterThanOrEqual(82);
  });

  it("lays out no dies as an empty wafer centred at the origin", () => {
    const layout = mapLayout([], geometry);
    expect(layout.rects).toEqual([]);
    expect(layout.centre).toEqual({ x: 0, y: 0 });
  });

  it("refuses an impossible geometry", () => {
    expect(() => mapLayout(grid, { ...geometry, dieWidthMm: 0 })).toThrow(RangeError);
    expect(() => mapLayout(grid, { ...geometry, edgeExclusionMm: 60 })).toThrow(RangeError);
  });
});
