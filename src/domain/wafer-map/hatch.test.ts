import { describe, expect, it } from "vitest";
import { hatchSegments } from "./hatch";

const EPS = 1e-9;

function onEdge(x: number, y: number, left: number, top: number, w: number, h: number): boolean {
  const inside = x >= left - EPS && x <= left + w + EPS && y >= top - EPS && y <= top + h + EPS;
  const edge = [Math.abs(x - left), Math.abs(x - left - w), Math.abs(y - top), Math.abs(y - top - h)].some((d) => d < EPS);
  return inside && edge;
}

describe("hatchSegments", () => {
  it("draws rising diagonals whose ends lie on the rectangle's edge", () => {
    const segments = hatchSegments(10, 20, 12, 8, 3);
    expect(segments.length).toBeGreaterThan(0);
    for (const [x1, y1, x2, y2] of segments) {
      expect(onEdge(x1, y1, 10, 20, 12, 8)).toBe(true);
      expect(onEdge(x2, y2, 10, 20, 12, 8)).toBe(true);
      // screen y grows downward, so a "/" line has dy/dx = −1
      expect((y2 - y1) / (x2 - x1)).toBeCloseTo(-1, 12);
    }
  });

  it("spaces neighbouring lines by the requested perpendicular distance", () => {
    const segments = hatchSegments(0, 0, 10, 10, 2);
    // line u + v = c has perpendicular distance c/√2 from the corner; consecutive lines differ by the spacing
    const offsets = segments.map(([x1, y1]) => (x1 + y1) / Math.SQRT2);
    for (let i = 1; i < offsets.length; i++) expect((offsets[i] as number) - (offsets[i - 1] as number)).toBeCloseTo(2, 12);
    // c = k·2√2 < 20 → k = 1…7
    expect(segments).toHaveLength(7);
  });

  it("draws nothing for an empty rectangle or a non-positive spacing", () => {
    expect(hatchSegments(0, 0, 0, 5, 1)).toEqual([]);
    expect(hatchSegments(0, 0, 5, 5, 0)).toEqual([]);
    expect(hatchSegments(0, 0, 5, Number.NaN, 1)).toEqual([]);
  });
});
