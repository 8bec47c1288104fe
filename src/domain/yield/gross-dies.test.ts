import { describe, expect, it } from "vitest";
import { waferGeometry, type WaferGeometry } from "./geometry";
import { countDiesInside, grossDiesPerWafer } from "./gross-dies";

function geometry(waferDiameterMm: number, dieWidthMm: number, dieHeightMm: number, edgeExclusionMm = 0): WaferGeometry {
  return waferGeometry({ dieWidthMm, dieHeightMm, waferDiameterMm, edgeExclusionMm });
}

/** Independent check: place every die of each grid offset and test its four corners against the circle. */
function bruteForceCount(g: WaferGeometry): number {
  const { dieWidthMm: w, dieHeightMm: h, usableRadiusMm: r } = g;
  const reach = Math.ceil(r / Math.min(w, h)) + 2;
  let best = 0;
  for (const ox of [0, 0.5]) {
    for (const oy of [0, 0.5]) {
      let count = 0;
      for (let i = -reach; i <= reach; i++) {
        for (let j = -reach; j <= reach; j++) {
          const cx = (i + ox) * w;
          const cy = (j + oy) * h;
          const corners = [
            [cx - w / 2, cy - h / 2],
            [cx + w / 2, cy - h / 2],
            [cx - w / 2, cy + h / 2],
            [cx + w / 2, cy + h / 2],
          ] as const;
          if (corners.every(([x, y]) => Math.hypot(x, y) <= r * (1 + 1e-12))) count++;
        }
      }
      best = Math.max(best, count);
    }
  }
  return best;
}

describe("grossDiesPerWafer", () => {
  it("gives ≈ 640.2 dies for a 300 mm wafer and a 10 × 10 mm die", () => {
    // π·300²/(4·100) = 706.858; π·300/√200 = 66.643; 706.858 − 66.643 = 640.215
    expect(grossDiesPerWafer(300, 100)).toBeCloseTo(640.215, 3);
  });

  it("gives ≈ 269.7 dies for a 200 mm wafer and a 1 cm² die", () => {
    // π·200²/400 = 314.159; π·200/√200 = 44.429; difference 269.730
    expect(grossDiesPerWafer(200, 100)).toBeCloseTo(269.73, 2);
  });

  it("never goes negative when the die is as large as the wafer", () => {
    // π·10²/(4·100) = 0.785 < π·10/√200 = 2.221
    expect(grossDiesPerWafer(10, 100)).toBe(0);
  });

  it("refuses non-positive and non-finite inputs", () => {
    expect(() => grossDiesPerWafer(0, 100)).toThrow(RangeError);
    expect(() => grossDiesPerWafer(300, -1)).toThrow(RangeError);
    expect(() => grossDiesPerWafer(Number.POSITIVE_INFINITY, 100)).toThrow(RangeError);
  });
});

describe("countDiesInside", () => {
  it("fits a 4 × 4 block less its corners (12 dies) of 1 mm dies on a 5 mm disc", () => {
    // R = 2.5 mm. Grid line through the centre: corner dies reach (2, 2), √8 = 2.83 > 2.5, so they drop;
    // the dies beside them reach (2, 1), √5 = 2.24 ≤ 2.5. A centred die gives only 9 (3 + 3 + 3 columns).
    expect(countDiesInside(geometry(5, 1, 1))).toBe(12);
  });

  it("fits four 2 mm dies whose outer corners touch the circle exactly", () => {
    // R = 2√2: the 2 × 2 block of 2 mm dies has its corners at (±2, ±2), distance 2√2 — on the circle, inside.
    // A centred die alone reaches √2, its neighbours (3, 1) at √10 > 2√2, so that placement gives 1.
    expect(countDiesInside(geometry(4 * Math.SQRT2, 2, 2))).toBe(4);
  });

  it("picks the best of the four placements for an oblong die", () => {
    // 2 × 1 mm dies, R = √4.25 = 2.062 mm.
    // Centred: one column x ∈ [−1, 1]; rows y ∈ [−0.5, 0.5] and [0.5, 1.5] (corner (1, 1.5), √3.25 = 1.80) fit,
    // [1.5, 2.5] does not (corner (1, 2.5), 2.69) → 3. Grid line in x: row 0 gives 2 (corner (2, 0.5) = R) → 2.
    expect(countDiesInside(geometry(2 * Math.sqrt(4.25), 2, 1))).toBe(3);
  });

  it("finds no whole die when the disc is smaller than a die's diagonal", () => {
    // Die diagonal √2·10 = 14.1 mm > 12 mm usable diameter.
    expect(countDiesInside(geometry(12, 10, 10))).toBe(0);
  });

  it("counts 10 × 10 mm dies on a 300 mm wafer between the estimate and the area bound", () => {
    const count = countDiesInside(geometry(300, 10, 10));
    expect(count).toBeGreaterThanOrEqual(Math.floor(grossDiesPerWafer(300, 100)));
    expect(count).toBeLessThanOrEqual(Math.floor((Math.PI * 150 * 150) / 100)); // 706
    expect(count).toBe(bruteForceCount(geometry(300, 10, 10)));
  });

  it("agrees with a corner-by-corner count for oblong dies and edge exclusions", () => {
    const cases: Array<[number, number, number, number]> = [
      [300, 10, 10, 3],
      [200, 5, 7, 3],
      [150, 4, 6, 3],
      [100, 3.3, 2.1, 5],
      [50, 12, 1.5, 1],
    ];
    for (const [d, w, h, e] of cases) {
      const g = geometry(d, w, h, e);
      expect(countDiesInside(g), `${d} mm wafer, ${w} × ${h} mm die, ${e} mm exclusion`).toBe(bruteForceCount(g));
    }
  });
});
