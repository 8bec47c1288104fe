import { describe, expect, it } from "vitest";
import { dieColumns, dieCsv } from "./die-csv";

describe("dieCsv", () => {
  it("writes the §9 names as the header and quotes cells as RFC 4180 does", () => {
    const csv = dieCsv([{ wafer: 1, x: 2, y: -3, bin: "NODATA", reason: 'only 2 points, "too few"', conductanceS: null }], ["wafer", "x", "y", "bin", "conductanceS", "reason"]);
    expect(csv).toBe('wafer,x,y,bin,conductanceS,reason\n1,2,-3,NODATA,,"only 2 points, ""too few"""\n');
  });

  it("keeps wafer, x and y and the §9 order whatever fields are asked for", () => {
    expect(dieColumns(["bin", "conductanceS"])).toEqual(["wafer", "x", "y", "conductanceS", "bin"]);
    expect(dieColumns()).toHaveLength(18);
  });
});
