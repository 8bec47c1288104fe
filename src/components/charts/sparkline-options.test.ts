import { describe, expect, it } from "vitest";
import { sparklineOption } from "./sparkline-options";

describe("sparklineOption", () => {
  it("marks only the last value and leaves gaps for non-finite ones", () => {
    const [series] = sparklineOption([1, Number.NaN, 3]).series as { data: { value: number | string; symbol: string }[] }[];
    expect(series?.data.map((d) => d.value)).toEqual([1, "-", 3]);
    expect(series?.data.map((d) => d.symbol)).toEqual(["none", "none", "circle"]);
  });
});
