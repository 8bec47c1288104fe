import { describe, expect, it } from "vitest";
import { droppedFrames, formatTable, intervals, median, quantile } from "./map-stats";

describe("quantile (Hyndman & Fan definition 7, as R's default quantile and numpy's linear method)", () => {
  it("interpolates between order statistics: h = (n − 1)·q", () => {
    // R: quantile(c(1, 2, 3, 4, 10), 0.95) = 8.8 (h = 3.8 → 4 + 0.8·(10 − 4))
    expect(quantile([10, 1, 3, 2, 4], 0.95)).toBeCloseTo(8.8, 12);
    expect(quantile([1, 2, 3, 4], 0.25)).toBeCloseTo(1.75, 12);
  });
  it("gives the middle value or the mean of the two middle values as the median", () => {
    expect(median([5, 1, 3])).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
  });
  it("returns the extremes at q = 0 and q = 1 and the value itself for one value", () => {
    expect(quantile([3, 9, 1], 0)).toBe(1);
    expect(quantile([3, 9, 1], 1)).toBe(9);
    expect(quantile([7], 0.95)).toBe(7);
  });
  it("is NaN for no values and refuses q outside [0, 1]", () => {
    expect(quantile([], 0.5)).toBeNaN();
    expect(() => quantile([1], 1.5)).toThrow(RangeError);
    expect(() => quantile([1], Number.NaN)).toThrow(RangeError);
  });
});

describe("droppedFrames", () => {
  it("counts the vsyncs skipped between rAF timestamps", () => {
    const interval = 1000 / 60;
    // intervals of 1, 1, 3 and 2 frames: 0 + 0 + 2 + 1 missed
    const times = [0, 1, 2, 5, 7].map((k) => k * interval);
    expect(droppedFrames(times, interval)).toBe(3);
  });
  it("is 0 for fewer than two timestamps and refuses a non-positive interval", () => {
    expect(droppedFrames([5], 16.7)).toBe(0);
    expect(() => droppedFrames([0, 16], 0)).toThrow(RangeError);
  });
});

describe("intervals and formatTable", () => {
  it("takes consecutive differences", () => {
    expect(intervals([1, 4, 9])).toEqual([3, 5]);
    expect(intervals([1])).toEqual([]);
  });
  it("left-aligns the first column and right-aligns the others to their widest cell", () => {
    expect(formatTable(["a", "bb"], [["xyz", "1"]])).toBe(["a    bb", "---  --", "xyz   1"].join("\n"));
  });
});
