import { describe, expect, it } from "vitest";
import { conductanceFromUnit, conductanceIn, formatConductance, formatPercent } from "./format";

describe("units printed beside values", () => {
  it("expresses conductance in µS and in G₀ = 2q²/h (7.7480917299e-5 S, §5 check value)", () => {
    expect(conductanceIn(2.2e-4, "uS")).toBeCloseTo(220, 10);
    expect(conductanceIn(7.7480917299e-5, "G0")).toBeCloseTo(1, 9);
    expect(conductanceFromUnit(3.5, "G0")).toBeCloseTo(3.5 * 7.7480917299e-5, 14);
    expect(formatConductance(2.2e-4, "uS")).toBe("220 µS");
    expect(formatConductance(2 * 7.7480917299e-5, "G0")).toBe("2 G₀");
    expect(formatConductance(null, "S")).toBe("—");
  });

  it("prints yields as percentages with a space before the sign", () => {
    expect(formatPercent(0.9321)).toBe("93.2 %");
    expect(formatPercent(null)).toBe("—");
  });
});
