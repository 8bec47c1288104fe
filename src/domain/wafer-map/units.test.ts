import { describe, expect, it } from "vitest";
import { conductanceTitle, conductanceUnit, conductanceUnitSymbol, scaleConductance, siemensPerUnit } from "./units";

describe("conductanceUnit", () => {
  it("reads the usual spellings of S, µS and 2q²/h", () => {
    expect(conductanceUnit("S")).toBe("S");
    expect(conductanceUnit("uS")).toBe("µS");
    expect(conductanceUnit("\u00b5S")).toBe("µS");
    expect(conductanceUnit("\u03bcS")).toBe("µS");
    expect(conductanceUnit("G0")).toBe("G0");
    expect(conductanceUnit(" 2q²/h ")).toBe("G0");
    expect(conductanceUnit("2e^2/h")).toBe("G0");
  });

  it("falls back to µS for missing or unknown text", () => {
    expect(conductanceUnit(undefined)).toBe("µS");
    expect(conductanceUnit(null)).toBe("µS");
    expect(conductanceUnit("")).toBe("µS");
    expect(conductanceUnit("ohm")).toBe("µS");
  });
});

describe("scaleConductance", () => {
  it("expresses G in units of G₀ = 2q²/h, with the §5 check value G₀ = 7.7480917299e-5 S", () => {
    expect(siemensPerUnit("G0")).toBeCloseTo(7.7480917299e-5, 15);
    expect(scaleConductance(7.7480917299e-5, "G0")).toBeCloseTo(1, 9);
    expect(scaleConductance(3 * 7.7480917299e-5, "G0")).toBeCloseTo(3, 9);
  });

  it("converts S to µS by 1e6 and leaves S alone", () => {
    expect(scaleConductance(7.7480917299e-5, "µS")).toBeCloseTo(77.480917299, 9);
    expect(scaleConductance(2.5e-3, "S")).toBe(2.5e-3);
  });

  it("gives null for a missing or non-finite conductance", () => {
    expect(scaleConductance(null, "µS")).toBeNull();
    expect(scaleConductance(undefined, "S")).toBeNull();
    expect(scaleConductance(Number.NaN, "G0")).toBeNull();
    expect(scaleConductance(Number.POSITIVE_INFINITY, "µS")).toBeNull();
  });
});

describe("conductance labels", () => {
  it("prints the unit in legend titles and beside values", () => {
    expect(conductanceTitle("µS")).toBe("G (µS)");
    expect(conductanceTitle("S")).toBe("G (S)");
    expect(conductanceTitle("G0")).toBe("G/G₀");
    expect(conductanceUnitSymbol("G0")).toBe("G₀");
    expect(conductanceUnitSymbol("µS")).toBe("µS");
  });
});
