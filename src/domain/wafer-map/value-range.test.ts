import { describe, expect, it } from "vitest";
import { colourScaleRange } from "./value-range";

describe("colourScaleRange", () => {
  it("spans the 2nd to 98th percentile (type 7, as R's quantile(1:101, c(.02, .98)) = 3, 99)", () => {
    const values = Array.from({ length: 101 }, (_, i) => 101 - i);
    expect(colourScaleRange(values)).toEqual({ min: 3, max: 99 });
  });

  it("keeps a lone short out of the scale", () => {
    const values = [...Array.from({ length: 99 }, (_, i) => 10 + i / 98), 1e6];
    const range = colourScaleRange(values);
    expect(range?.max).toBeLessThan(20);
  });

  it("ignores missing and non-finite values", () => {
    expect(colourScaleRange([null, 1, Number.NaN, 2, Number.POSITIVE_INFINITY, 3])).toEqual(colourScaleRange([1, 2, 3]));
  });

  it("widens a zero-width range by 5 % either side, or by 1 around zero", () => {
    const range = colourScaleRange([4, 4, 4]);
    expect(range?.min).toBeCloseTo(3.8, 12);
    expect(range?.max).toBeCloseTo(4.2, 12);
    expect(colourScaleRange([0])).toEqual({ min: -1, max: 1 });
  });

  it("gives null when no value is finite", () => {
    expect(colourScaleRange([])).toBeNull();
    expect(colourScaleRange([null, Number.NaN])).toBeNull();
  });
});
