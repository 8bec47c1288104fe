import { describe, expect, it } from "vitest";
import { chartConstants } from "./constants";
import { limitSetFromBaseline, type BaselineWafer } from "./limit-set";

const uS = 1e-6;
const wafer = (medianUs: number, yieldFraction: number): BaselineWafer => ({ medianConductanceS: medianUs * uS, yieldFraction });

// Three lots in probing order, wafers in slot order; lot C has one wafer only.
const baseline = [
  [wafer(10, 0.9), wafer(12, 0.92), wafer(11, 0.88)],
  [wafer(13, 0.91), wafer(12, 0.93)],
  [wafer(11, 0.95)],
];

function expectRelative(actual: number | undefined, expected: number, relative = 1e-12): void {
  expect(Math.abs((actual ?? Number.NaN) - expected)).toBeLessThanOrEqual(relative * Math.abs(expected));
}

describe("limitSetFromBaseline individuals limits", () => {
  const limits = limitSetFromBaseline(baseline);

  it("charts wafer yield across lots in order: MR = .02, .04, .03, .02, .02 → MR̄ = 0.026, σ̂ = MR̄/d₂(2)", () => {
    const yieldLimits = limits.waferYieldFraction.individuals;
    expect(yieldLimits.count).toBe(6);
    expectRelative(yieldLimits.center, 5.49 / 6);
    expectRelative(yieldLimits.mrBar, 0.026, 1e-9);
    expectRelative(yieldLimits.sigma, 0.026 / chartConstants(2).d2, 1e-9);
    expectRelative(yieldLimits.ucl, 5.49 / 6 + (3 * 0.026) / chartConstants(2).d2, 1e-9);
  });

  it("charts wafer median G in siemens the same way", () => {
    // 10, 12, 11, 13, 12, 11 µS: MR = 2, 1, 2, 1, 1 → MR̄ = 1.4 µS
    const g = limits.waferMedianConductanceS.individuals;
    expectRelative(g.center, (69 / 6) * uS);
    expectRelative(g.mrBar, 1.4 * uS);
    expectRelative(g.mrUcl, chartConstants(2).D4 * 1.4 * uS);
    expect(g.mrLcl).toBe(0);
  });
});

describe("limitSetFromBaseline lot X̄–S limits", () => {
  it("uses lots with 2 or more wafers as subgroups and pools their unequal sizes", () => {
    // Lot A: 10, 12, 11 µS (x̄ 11, s 1); lot B: 13, 12 µS (x̄ 12.5, s² 0.5); lot C is left out.
    // x̿ = (33 + 25)/5 = 11.6 µS; pooled s̄ = √((2·1 + 1·0.5)/3) µS.
    const lot = limitSetFromBaseline(baseline).waferMedianConductanceS.lotXbarS;
    const sBar = Math.sqrt(2.5 / 3) * uS;
    expect(lot?.subgroupCount).toBe(2);
    expectRelative(lot?.center, 11.6 * uS);
    expectRelative(lot?.sBar, sBar);
    // Sizes 3 and 2 tie, so the nominal size is the larger, 3.
    expect(lot?.nominalSize).toBe(3);
    expectRelative(lot?.ucl, 11.6 * uS + chartConstants(3).A3 * sBar);
    expectRelative(lot?.sUcl, chartConstants(3).B4 * sBar);
  });

  it("is null when no lot has two usable wafers", () => {
    const limits = limitSetFromBaseline([[wafer(10, 0.9)], [wafer(11, 0.8)]]);
    expect(limits.waferYieldFraction.lotXbarS).toBeNull();
    expect(limits.waferYieldFraction.individuals.count).toBe(2);
  });
});

describe("limitSetFromBaseline input handling", () => {
  it("leaves a wafer without a median G out of the G charts but keeps its yield", () => {
    const limits = limitSetFromBaseline([[wafer(10, 0.9), wafer(Number.NaN, 0), wafer(12, 0.8)]]);
    expect(limits.waferMedianConductanceS.individuals.count).toBe(2);
    expectRelative(limits.waferMedianConductanceS.individuals.mrBar, 2 * uS);
    expect(limits.waferYieldFraction.individuals.count).toBe(3);
  });

  it("refuses a baseline with fewer than two usable wafers", () => {
    expect(() => limitSetFromBaseline([])).toThrow(RangeError);
    expect(() => limitSetFromBaseline([[wafer(10, 0.9)]])).toThrow(RangeError);
  });

  it("refuses a yield outside 0–1 (a percentage passed by mistake)", () => {
    expect(() => limitSetFromBaseline([[wafer(10, 90), wafer(11, 80)]])).toThrow(RangeError);
  });
});
