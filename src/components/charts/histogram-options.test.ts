import { describe, expect, it } from "vitest";
import { binIndexOf, histogramOption, histogramOutline } from "./histogram-options";

const edges = [10, 11, 12, 13];

describe("histogramOutline", () => {
  it("steps up and down each bin from and back to zero", () => {
    expect(histogramOutline(edges, [2, 5, 1])).toEqual([
      [10, 0],
      [10, 2],
      [11, 2],
      [11, 5],
      [12, 5],
      [12, 1],
      [13, 1],
      [13, 0],
    ]);
  });

  it("refuses counts that do not match the edges, and draws nothing for no bins", () => {
    expect(() => histogramOutline(edges, [1, 2])).toThrow(RangeError);
    expect(histogramOutline([10], [])).toEqual([]);
  });
});

describe("binIndexOf", () => {
  it("finds the half-open bin, closing the last one on the right", () => {
    expect(binIndexOf(edges, 10)).toBe(0);
    expect(binIndexOf(edges, 11.5)).toBe(1);
    expect(binIndexOf(edges, 12)).toBe(2);
    expect(binIndexOf(edges, 13)).toBe(2);
  });

  it("gives null outside the edges or for NaN", () => {
    expect(binIndexOf(edges, 9.9)).toBeNull();
    expect(binIndexOf(edges, 13.1)).toBeNull();
    expect(binIndexOf(edges, Number.NaN)).toBeNull();
  });
});

describe("histogramOption", () => {
  const option = histogramOption({
    edges,
    series: [
      { name: "Wafer 1", counts: [2, 5, 1] },
      { name: "Wafer 2", counts: [0, 3, 4] },
    ],
    valueTitle: "G (µS)",
  });

  it("overlays one outline per wafer on an axis titled with the unit", () => {
    expect((option.series as { name: string }[]).map((s) => s.name)).toEqual(["Wafer 1", "Wafer 2"]);
    expect((option.xAxis as { name: string; min: number; max: number }).name).toBe("G (µS)");
    expect((option.yAxis as { name: string }).name).toBe("Dies");
  });

  it("lists every wafer's count for the bin under the pointer", () => {
    const formatter = (option.tooltip as { formatter: (p: unknown) => string }).formatter;
    const html = formatter([{ axisValue: 12.4 }]);
    expect(html).toContain("G (µS): 12 to 13");
    expect(html).toMatch(/Wafer 1<\/td><td>1</);
    expect(html).toMatch(/Wafer 2<\/td><td>4</);
  });
});
