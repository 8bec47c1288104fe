import { describe, expect, it } from "vitest";
import { CIVIDIS_STOPS, cividis, contrastInk, relativeLuminance } from "./cividis";

function channels(hex: string): number[] {
  return [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
}

// CIE 1976 L* from relative luminance Y (published CIE formula, Yn = 1).
function lightness(hex: string): number {
  const y = relativeLuminance(hex);
  return y > (6 / 29) ** 3 ? 116 * Math.cbrt(y) - 16 : (29 / 3) ** 3 * y;
}

describe("cividis", () => {
  it("starts and ends on the published table's first and last rows (from memory), within one 8-bit step", () => {
    // Nuñez, Anderton & Renslow 2018 table: first row (0.0000, 0.1262, 0.3015), last row (1.0000, 0.9169, 0.2731).
    const first = [0, 0.1262, 0.3015].map((c) => c * 255);
    const last = [1, 0.9169, 0.2731].map((c) => c * 255);
    channels(cividis(0)).forEach((c, i) => expect(Math.abs(c - (first[i] as number))).toBeLessThanOrEqual(1));
    channels(cividis(1)).forEach((c, i) => expect(Math.abs(c - (last[i] as number))).toBeLessThanOrEqual(1));
  });

  it("gets lighter all the way along the scale", () => {
    let previous = -Infinity;
    for (let i = 0; i <= 200; i++) {
      const y = relativeLuminance(cividis(i / 200));
      expect(y).toBeGreaterThan(previous);
      previous = y;
    }
  });

  it("rises in CIE L* nearly linearly, as the scale was designed to (within 2 L* of the straight line)", () => {
    const l0 = lightness(cividis(0));
    const l1 = lightness(cividis(1));
    for (let i = 0; i <= 20; i++) {
      const t = i / 20;
      expect(Math.abs(lightness(cividis(t)) - (l0 + (l1 - l0) * t))).toBeLessThan(2);
    }
  });

  it("interpolates linearly between neighbouring control points", () => {
    // t = 0.5 is halfway between stops 4 and 5 of the 10 (positions 4/9 and 5/9).
    const a = channels(CIVIDIS_STOPS[4] as string);
    const b = channels(CIVIDIS_STOPS[5] as string);
    channels(cividis(0.5)).forEach((c, i) => expect(Math.abs(c - ((a[i] as number) + (b[i] as number)) / 2)).toBeLessThanOrEqual(0.5));
    expect(cividis(4 / 9)).toBe(CIVIDIS_STOPS[4]);
  });

  it("clamps t outside [0, 1] and maps NaN to the low end", () => {
    expect(cividis(-3)).toBe(cividis(0));
    expect(cividis(7)).toBe(cividis(1));
    expect(cividis(Number.NaN)).toBe(cividis(0));
  });
});

describe("relativeLuminance and contrastInk", () => {
  it("matches the WCAG 2 values for black, white and pure red (0.2126)", () => {
    expect(relativeLuminance("#000000")).toBe(0);
    expect(relativeLuminance("#ffffff")).toBeCloseTo(1, 12);
    expect(relativeLuminance("#FF0000")).toBeCloseTo(0.2126, 12);
  });

  it("picks white ink on the dark end of cividis and black on the light end", () => {
    expect(contrastInk(cividis(0))).toBe("#ffffff");
    expect(contrastInk(cividis(1))).toBe("#000000");
  });

  it("refuses a malformed colour", () => {
    expect(() => relativeLuminance("teal")).toThrow(RangeError);
  });
});
