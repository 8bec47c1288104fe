import { describe, expect, it } from "vitest";
import { containsPoint, intersectRect } from "./rect-px";

const plot = { x: 10, y: 10, width: 100, height: 50 };

describe("intersectRect", () => {
  it("keeps a rectangle wholly inside", () => {
    expect(intersectRect({ x: 20, y: 20, width: 5, height: 4 }, plot)).toEqual({ x: 20, y: 20, width: 5, height: 4 });
  });

  it("cuts a rectangle that straddles a corner down to the overlap", () => {
    expect(intersectRect({ x: 105, y: 5, width: 10, height: 10 }, plot)).toEqual({ x: 105, y: 10, width: 5, height: 5 });
  });

  it("gives null for a rectangle outside or only touching an edge", () => {
    expect(intersectRect({ x: 200, y: 20, width: 5, height: 5 }, plot)).toBeNull();
    expect(intersectRect({ x: 110, y: 20, width: 5, height: 5 }, plot)).toBeNull();
  });
});

describe("containsPoint", () => {
  it("includes the edges and excludes points beyond them", () => {
    expect(containsPoint(plot, 10, 60)).toBe(true);
    expect(containsPoint(plot, 110.01, 30)).toBe(false);
  });
});
