import { describe, expect, it } from "vitest";
import { isOutOfWindow, patDieWindow, staticDieWindow } from "./die-window";
import { MAD_NORMAL_CONSISTENCY } from "./robust";

// Conductances written in µS and scaled to S; median 10 µS and MAD 1 µS by construction, one 40 µS outlier.
const uS = 1e-6;
const baselineS = [7, 9, 9.5, 10, 10, 10.5, 11, 13, 40].map((g) => g * uS);

describe("staticDieWindow", () => {
  it("centres on the median and spans k·1.4826·MAD (k = 3 by default)", () => {
    // |g − 10| = 3, 1, .5, 0, 0, .5, 1, 3, 30 µS → MAD = 1 µS
    const window = staticDieWindow(baselineS);
    expect(window?.method).toBe("static");
    expect(window?.k).toBe(3);
    expect(window?.centerS).toBeCloseTo(10 * uS, 18);
    expect(window?.sigmaS).toBeCloseTo(MAD_NORMAL_CONSISTENCY * uS, 18);
    expect(window?.lowS).toBeCloseTo((10 - 3 * MAD_NORMAL_CONSISTENCY) * uS, 18);
    expect(window?.highS).toBeCloseTo((10 + 3 * MAD_NORMAL_CONSISTENCY) * uS, 18);
  });

  it("honours a custom k and skips non-finite conductances", () => {
    const window = staticDieWindow([...baselineS, Number.NaN, Number.POSITIVE_INFINITY], 2);
    expect(window?.highS).toBeCloseTo((10 + 2 * MAD_NORMAL_CONSISTENCY) * uS, 18);
  });

  it("collapses onto the median when every die reads the same", () => {
    const window = staticDieWindow([5 * uS, 5 * uS, 5 * uS]);
    expect(window).toMatchObject({ lowS: 5 * uS, highS: 5 * uS, centerS: 5 * uS, sigmaS: 0 });
    if (window === null) throw new Error("expected a window");
    expect(isOutOfWindow(5 * uS, window)).toBe(false);
    expect(isOutOfWindow(5.000001 * uS, window)).toBe(true);
  });

  it("returns null when no finite conductance is left", () => {
    expect(staticDieWindow([])).toBeNull();
    expect(staticDieWindow([Number.NaN])).toBeNull();
  });

  it("refuses a negative or non-finite k", () => {
    expect(() => staticDieWindow(baselineS, -1)).toThrow(RangeError);
    expect(() => staticDieWindow(baselineS, Number.NaN)).toThrow(RangeError);
  });
});

describe("patDieWindow", () => {
  it("spans the median ± 6·IQR/1.35 of the PASS dies (AEC-Q001 dynamic PAT)", () => {
    // 1…9 µS: median 5, Q₁ = 3, Q₃ = 7 (type 7) → robust σ = 4/1.35 µS
    const window = patDieWindow([1, 2, 3, 4, 5, 6, 7, 8, 9].map((g) => g * uS));
    expect(window?.method).toBe("pat");
    expect(window?.k).toBe(6);
    expect(window?.sigmaS).toBeCloseTo((4 / 1.35) * uS, 18);
    expect(window?.lowS).toBeCloseTo((5 - (6 * 4) / 1.35) * uS, 18);
    expect(window?.highS).toBeCloseTo((5 + (6 * 4) / 1.35) * uS, 18);
  });

  it("collapses onto the median for zero spread and returns null for no PASS dies", () => {
    expect(patDieWindow([2 * uS, 2 * uS])).toMatchObject({ lowS: 2 * uS, highS: 2 * uS, sigmaS: 0 });
    expect(patDieWindow([])).toBeNull();
  });
});

describe("isOutOfWindow", () => {
  const window = { lowS: 1 * uS, highS: 2 * uS, centerS: 1.5 * uS, sigmaS: 0.1 * uS, k: 5, method: "static" as const };

  it("flags dies strictly below the low or above the high limit", () => {
    expect(isOutOfWindow(0.99 * uS, window)).toBe(true);
    expect(isOutOfWindow(2.01 * uS, window)).toBe(true);
    expect(isOutOfWindow(1.5 * uS, window)).toBe(false);
  });

  it("keeps a die exactly on a limit inside the window", () => {
    expect(isOutOfWindow(1 * uS, window)).toBe(false);
    expect(isOutOfWindow(2 * uS, window)).toBe(false);
  });

  it("never flags a non-finite conductance, which its NODATA bin already reports", () => {
    expect(isOutOfWindow(Number.NaN, window)).toBe(false);
    expect(isOutOfWindow(Number.POSITIVE_INFINITY, window)).toBe(false);
  });
});
