import { describe, expect, it } from "vitest";
import { findDie, nearestDie, stepDie } from "./navigation";

// Row y = 0 has a gap at x = 2; column x = 1 spans y = −1..1.
const dies = [
  { x: 0, y: 0 },
  { x: 1, y: 0 },
  { x: 3, y: 0 },
  { x: 1, y: 1 },
  { x: 1, y: -1 },
];

describe("stepDie", () => {
  it("moves to the neighbour in the row and skips a gap", () => {
    expect(stepDie(dies, 0, "right")).toBe(1);
    expect(stepDie(dies, 1, "right")).toBe(2);
    expect(stepDie(dies, 2, "left")).toBe(1);
  });

  it("moves up to larger die_y and down to smaller", () => {
    expect(stepDie(dies, 1, "up")).toBe(3);
    expect(stepDie(dies, 1, "down")).toBe(4);
  });

  it("stays put at the end of a row or column", () => {
    expect(stepDie(dies, 2, "right")).toBe(2);
    expect(stepDie(dies, 0, "left")).toBe(0);
    expect(stepDie(dies, 3, "up")).toBe(3);
    expect(stepDie(dies, 0, "up")).toBe(0);
  });

  it("refuses an index that is not a die", () => {
    expect(() => stepDie(dies, 9, "up")).toThrow(RangeError);
  });
});

describe("nearestDie and findDie", () => {
  it("finds the die nearest a point, or none on an empty wafer", () => {
    expect(nearestDie(dies, { x: 2.9, y: 0.2 })).toBe(2);
    expect(nearestDie([], { x: 0, y: 0 })).toBeNull();
  });

  it("finds a die by its grid position", () => {
    expect(findDie(dies, { x: 1, y: -1 })).toBe(4);
    expect(findDie(dies, { x: 2, y: 0 })).toBeNull();
    expect(findDie(dies, null)).toBeNull();
  });
});
