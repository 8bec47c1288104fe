import { describe, expect, it } from "vitest";
import { concatSweeps, decodeSweep, encodeSweep } from "./sweep-codec";

describe("the compact sweep kept with each die", () => {
  it("round-trips bias, current and compliance exactly", () => {
    const bias = Float64Array.from([-0.01, 0, 0.01, 1e-7]);
    const current = Float64Array.from([-7.742e-7, 1e-15, 7.742e-7, -3.3e-12]);
    const compliance = Uint8Array.from([0, 0, 1, 0]);
    const bytes = encodeSweep(bias, current, compliance, 4);
    expect(bytes.length).toBe(96);
    const back = decodeSweep(bytes);
    expect(Array.from(back.biasV)).toEqual(Array.from(bias));
    expect(Array.from(back.currentA)).toEqual(Array.from(current));
    expect(Array.from(back.compliance)).toEqual([0, 0, 1, 0]);
  });

  it("joins the runs of a split die in file order", () => {
    const a = decodeSweep(encodeSweep(Float64Array.from([1, 2]), Float64Array.from([3, 4]), Uint8Array.from([0, 1]), 2));
    const b = decodeSweep(encodeSweep(Float64Array.from([5]), Float64Array.from([6]), Uint8Array.from([0]), 1));
    const joined = concatSweeps([a, b]);
    expect(Array.from(joined.biasV)).toEqual([1, 2, 5]);
    expect(Array.from(joined.currentA)).toEqual([3, 4, 6]);
    expect(Array.from(joined.compliance)).toEqual([0, 1, 0]);
  });
});
