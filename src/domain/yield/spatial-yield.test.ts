import { describe, expect, it } from "vitest";
import { assignZones, waferGeometry, type RadialZone } from "./geometry";
import { edgeVersusCentre, stackedFailMap, zoneYields, zoneYieldsFromCounts } from "./spatial-yield";
import type { Bin } from "./yield";

function dies(zone: RadialZone, pass: number, fail: number, failBin: Bin = "LOW") {
  return [
    ...Array.from({ length: pass }, () => ({ zone, bin: "PASS" as Bin })),
    ...Array.from({ length: fail }, () => ({ zone, bin: failBin })),
  ];
}

describe("zoneYields", () => {
  it("computes PASS / tested per zone, counting NODATA as tested", () => {
    // centre 9/10, middle 6/8, edge 3/12 (fails NODATA), outside 0/2
    const zoned = [...dies("centre", 9, 1), ...dies("middle", 6, 2), ...dies("edge", 3, 9, "NODATA"), ...dies("outside", 0, 2)];
    const zones = zoneYields(zoned);
    expect(zones.centre).toEqual({ tested: 10, pass: 9, yield: 0.9 });
    expect(zones.middle).toEqual({ tested: 8, pass: 6, yield: 0.75 });
    expect(zones.edge).toEqual({ tested: 12, pass: 3, yield: 0.25 });
    expect(zones.outside).toEqual({ tested: 2, pass: 0, yield: 0 });
  });

  it("reports an empty zone with a null yield", () => {
    expect(zoneYields(dies("centre", 1, 0)).edge).toEqual({ tested: 0, pass: 0, yield: null });
  });

  it("works on the output of assignZones", () => {
    // 5 mm dies, R = 45 mm, centre (9, 9): (9, 9) centre, (17, 9) at 40 mm edge, (16, 9) at 35 mm middle.
    const g = waferGeometry({ dieWidthMm: 5, dieHeightMm: 5, waferDiameterMm: 100, edgeExclusionMm: 5 });
    const map = [
      { x: 0, y: 9, bin: "OPEN" as Bin }, // 45 mm → edge
      { x: 18, y: 9, bin: "PASS" as Bin }, // 45 mm → edge
      { x: 9, y: 9, bin: "PASS" as Bin },
      { x: 16, y: 9, bin: "PASS" as Bin },
      { x: 17, y: 9, bin: "SHORT" as Bin },
    ];
    const zones = zoneYields(assignZones(map, g, { x: 9, y: 9 }));
    expect(zones.centre.yield).toBe(1);
    expect(zones.middle.yield).toBe(1);
    expect(zones.edge).toEqual({ tested: 3, pass: 1, yield: 1 / 3 });
  });
});

describe("edgeVersusCentre", () => {
  it("gives the centre-minus-edge gap, positive for an edge ring", () => {
    const result = edgeVersusCentre(zoneYields([...dies("centre", 19, 1), ...dies("edge", 12, 8)]));
    expect(result.centreYield).toBe(0.95);
    expect(result.edgeYield).toBe(0.6);
    expect(result.gap).toBeCloseTo(0.35, 12);
  });

  it("goes negative when the edge yields better than the centre", () => {
    expect(edgeVersusCentre(zoneYields([...dies("centre", 1, 1), ...dies("edge", 1, 0)])).gap).toBe(-0.5);
  });

  it("gives a null gap when either zone is empty", () => {
    expect(edgeVersusCentre(zoneYields(dies("centre", 3, 0)))).toEqual({ edgeYield: null, centreYield: 1, gap: null });
  });
});

describe("stackedFailMap", () => {
  it("stacks fail counts per position over wafers, NODATA counted as a fail", () => {
    const waferA = [
      { x: 0, y: 0, bin: "PASS" as Bin },
      { x: 1, y: 0, bin: "SHORT" as Bin },
      { x: 0, y: 1, bin: "NODATA" as Bin },
    ];
    const waferB = [
      { x: 1, y: 0, bin: "SHORT" as Bin },
      { x: 0, y: 0, bin: "LOW" as Bin },
    ];
    const waferC = [{ x: 1, y: 0, bin: "PASS" as Bin }];
    expect(stackedFailMap([waferA, waferB, waferC])).toEqual([
      { x: 0, y: 0, tested: 2, fails: 1, failRate: 0.5 },
      { x: 1, y: 0, tested: 3, fails: 2, failRate: 2 / 3 },
      { x: 0, y: 1, tested: 1, fails: 1, failRate: 1 },
    ]);
  });

  it("returns no cells for no wafers", () => {
    expect(stackedFailMap([])).toEqual([]);
    expect(stackedFailMap([[], []])).toEqual([]);
  });

  it("refuses a wafer that lists one position twice", () => {
    const wafer = [
      { x: 3, y: 4, bin: "PASS" as Bin },
      { x: 3, y: 4, bin: "LOW" as Bin },
    ];
    expect(() => stackedFailMap([wafer])).toThrow(RangeError);
  });
});

describe("zoneYieldsFromCounts", () => {
  it("gives what zoneYields gives for the same dies", () => {
    const zoned = [...dies("centre", 9, 1), ...dies("middle", 6, 2), ...dies("edge", 3, 9, "NODATA")];
    const counts = { centre: { tested: 10, pass: 9 }, middle: { tested: 8, pass: 6 }, edge: { tested: 12, pass: 3 }, outside: { tested: 0, pass: 0 } };
    expect(zoneYieldsFromCounts(counts)).toEqual(zoneYields(zoned));
  });

  it("refuses more PASS than tested and negative counts", () => {
    const empty = { tested: 0, pass: 0 };
    expect(() => zoneYieldsFromCounts({ centre: { tested: 1, pass: 2 }, middle: empty, edge: empty, outside: empty })).toThrow(RangeError);
    expect(() => zoneYieldsFromCounts({ centre: { tested: -1, pass: 0 }, middle: empty, edge: empty, outside: empty })).toThrow(RangeError);
  });
});
