import { describe, expect, it } from "vitest";
import tailwindConfig from "../../../tailwind.config";
import { BINS } from "../yield/yield";
import { BIN_COLOURS, BIN_ORDER } from "./bin-colours";

// §14 Okabe–Ito assignments, as written in the spec.
const SPEC_COLOURS = { PASS: "#009E73", LOW: "#56B4E9", HIGH: "#E69F00", OPEN: "#0072B2", SHORT: "#D55E00", NONLINEAR: "#CC79A7", NODATA: "#999999" };

describe("BIN_COLOURS", () => {
  it("uses the §14 Okabe–Ito colour for every bin", () => {
    expect(BIN_COLOURS).toEqual(SPEC_COLOURS);
  });

  it("agrees with the tailwind theme's bin colours, so maps and badges match", () => {
    const themeBins = (tailwindConfig.theme?.extend?.colors as Record<string, Record<string, string>>).bin ?? {};
    for (const bin of BINS) expect(themeBins[bin.toLowerCase()]?.toUpperCase()).toBe(BIN_COLOURS[bin].toUpperCase());
  });
});

describe("BIN_ORDER", () => {
  it("lists every bin once, PASS first and NODATA last", () => {
    expect([...BIN_ORDER].sort()).toEqual([...BINS].sort());
    expect(BIN_ORDER[0]).toBe("PASS");
    expect(BIN_ORDER[BIN_ORDER.length - 1]).toBe("NODATA");
  });
});
