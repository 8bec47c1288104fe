import { describe, expect, it } from "vitest";
import { assignZones, dieCentreMm, dieRadiusMm, gridCentre, radialZone, radialZoneBounds, waferGeometry } from "./geometry";

// Worked example used throughout: 5 × 5 mm dies on a 100 mm wafer with 5 mm edge exclusion.
// R = 100/2 − 5 = 45 mm; centre bound R/√3 = 25.981 mm; middle bound R·√(2/3) = 36.742 mm.
const square = waferGeometry({ dieWidthMm: 5, dieHeightMm: 5, waferDiameterMm: 100, edgeExclusionMm: 5 });

describe("waferGeometry", () => {
  it("derives the usable radius as half the diameter minus the edge exclusion", () => {
    expect(square.usableRadiusMm).toBe(45);
    expect(waferGeometry({ dieWidthMm: 1, dieHeightMm: 2, waferDiameterMm: 300, edgeExclusionMm: 0 }).usableRadiusMm).toBe(150);
  });

  it("refuses non-positive die sizes, a negative exclusion and an exclusion that eats the wafer", () => {
    expect(() => waferGeometry({ dieWidthMm: 0, dieHeightMm: 5, waferDiameterMm: 100, edgeExclusionMm: 3 })).toThrow(RangeError);
    expect(() => waferGeometry({ dieWidthMm: 5, dieHeightMm: Number.NaN, waferDiameterMm: 100, edgeExclusionMm: 3 })).toThrow(RangeError);
    expect(() => waferGeometry({ dieWidthMm: 5, dieHeightMm: 5, waferDiameterMm: 100, edgeExclusionMm: -1 })).toThrow(RangeError);
    expect(() => waferGeometry({ dieWidthMm: 5, dieHeightMm: 5, waferDiameterMm: 100, edgeExclusionMm: 50 })).toThrow(RangeError);
  });
});

describe("gridCentre", () => {
  it("takes the midpoint of the probed extents, which may fall between dies", () => {
    // x spans 2..11 → 6.5; y spans −3..5 → 1
    expect(gridCentre([{ x: 2, y: 0 }, { x: 11, y: -3 }, { x: 4, y: 5 }])).toEqual({ x: 6.5, y: 1 });
  });

  it("puts a single die at the centre", () => {
    expect(gridCentre([{ x: 7, y: -2 }])).toEqual({ x: 7, y: -2 });
  });

  it("refuses an empty map and non-finite indices", () => {
    expect(() => gridCentre([])).toThrow(RangeError);
    expect(() => gridCentre([{ x: Number.NaN, y: 0 }])).toThrow(RangeError);
  });
});

describe("dieCentreMm and dieRadiusMm", () => {
  const rect = waferGeometry({ dieWidthMm: 4, dieHeightMm: 6, waferDiameterMm: 150, edgeExclusionMm: 3 });

  it("scales grid offsets by the die width and height separately", () => {
    // (7 − 4.5)·4 = 10 mm; (−1 − 1)·6 = −12 mm
    expect(dieCentreMm(7, -1, { x: 4.5, y: 1 }, rect)).toEqual({ xMm: 10, yMm: -12 });
  });

  it("measures the die-centre radius as the hypotenuse of those offsets", () => {
    // 3·4 = 12 mm, 4·6 = 24 mm → √(144 + 576) = √720 = 26.8328 mm
    expect(dieRadiusMm(3, 4, { x: 0, y: 0 }, rect)).toBeCloseTo(Math.sqrt(720), 12);
    expect(dieRadiusMm(5, 5, { x: 5, y: 5 }, rect)).toBe(0);
  });
});

describe("radialZone", () => {
  it("splits the usable disc into equal-area thirds", () => {
    // Area of disc radius r ∝ r²: (R/√3)² = R²/3 and (R·√(2/3))² = 2R²/3, so each zone holds a third.
    const centreBound = 45 / Math.sqrt(3);
    const middleBound = 45 * Math.sqrt(2 / 3);
    expect(centreBound).toBeCloseTo(25.98076, 4);
    expect(middleBound).toBeCloseTo(36.74235, 4);
    expect(radialZone(centreBound, square)).toBe("centre");
    expect(radialZone(centreBound * (1 + 1e-12), square)).toBe("middle");
    expect(radialZone(middleBound, square)).toBe("middle");
    expect(radialZone(middleBound * (1 + 1e-12), square)).toBe("edge");
  });

  it("states the bounds it uses: R/√3, R·√(2/3), R", () => {
    expect(radialZoneBounds(square)).toEqual({ centre: 45 / Math.sqrt(3), middle: 45 * Math.sqrt(2 / 3), edge: 45 });
  });

  it("keeps a die centre exactly on the usable radius in the edge zone and puts one beyond it outside", () => {
    expect(radialZone(45, square)).toBe("edge");
    expect(radialZone(45.0001, square)).toBe("outside");
    expect(radialZone(0, square)).toBe("centre");
  });

  it("refuses a negative or NaN radius", () => {
    expect(() => radialZone(-1, square)).toThrow(RangeError);
    expect(() => radialZone(Number.NaN, square)).toThrow(RangeError);
  });
});

describe("assignZones", () => {
  it("zones the hand-computed dies of a 19 × 19 grid centred on (9, 9)", () => {
    // Corner dies (0,0) and (18,18) fix the extents, so the centre is (9, 9).
    const dies = [
      { x: 0, y: 0, id: "corner-low" }, // √(45² + 45²) = 63.64 mm → outside
      { x: 18, y: 18, id: "corner-high" }, // 63.64 mm → outside
      { x: 9, y: 9, id: "a" }, // 0 mm → centre
      { x: 14, y: 9, id: "b" }, // 5·5 = 25 mm ≤ 25.98 → centre
      { x: 15, y: 9, id: "c" }, // 30 mm → middle
      { x: 16, y: 11, id: "d" }, // √(35² + 10²) = √1325 = 36.40 mm ≤ 36.74 → middle
      { x: 9, y: 2, id: "e" }, // 7·5 = 35 mm → middle
      { x: 17, y: 9, id: "f" }, // 40 mm → edge
      { x: 9, y: 18, id: "g" }, // 45 mm = R → edge
      { x: 18, y: 10, id: "h" }, // √(45² + 5²) = 45.28 mm → outside
    ];
    const zoned = assignZones(dies, square);
    expect(zoned.map((d) => [d.id, d.zone])).toEqual([
      ["corner-low", "outside"],
      ["corner-high", "outside"],
      ["a", "centre"],
      ["b", "centre"],
      ["c", "middle"],
      ["d", "middle"],
      ["e", "middle"],
      ["f", "edge"],
      ["g", "edge"],
      ["h", "outside"],
    ]);
    expect(zoned.find((d) => d.id === "d")?.radiusMm).toBeCloseTo(Math.sqrt(1325), 12);
  });

  it("measures from a given centre instead of the probed extents when one is passed", () => {
    // From (0, 0): die (6, 0) sits 30 mm out → middle; the extents' own centre (3, 0) would put it at 15 mm → centre.
    const dies = [{ x: 0, y: 0 }, { x: 6, y: 0 }];
    expect(assignZones(dies, square)[1]?.zone).toBe("centre");
    expect(assignZones(dies, square, { x: 0, y: 0 })[1]?.zone).toBe("middle");
  });

  it("returns an empty list for an empty map", () => {
    expect(assignZones([], square)).toEqual([]);
  });
});
