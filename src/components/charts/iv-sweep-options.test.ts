import { describe, expect, it } from "vitest";
import { thermalVoltageV } from "@/domain/transport/constants";
import { currentUnit, ivSweepOption, type IvSweepInput } from "./iv-sweep-options";

// A 1 µS die swept ±50 mV in 5 mV steps with a small cubic term; V_w = 0.5·kT/q at 300 K (§5: ±12.93 mV).
const windowV = 0.5 * thermalVoltageV(300);
const g = 1e-6;
const points = Array.from({ length: 21 }, (_, i) => {
  const biasV = -0.05 + i * 0.005;
  return { biasV, currentA: g * biasV + 2e-5 * biasV ** 3 };
});
const input: IvSweepInput = {
  points,
  fit: { conductanceS: g, offsetA: 1e-10 },
  cubic: { offsetA: 0, conductanceS: g, quadraticAPerV2: 0, cubicAPerV3: 2e-5 },
  windowV,
};

type Series = { id: string; data: number[][]; markArea?: { data: { xAxis: number; name?: string }[][] }; lineStyle?: { type?: string } };

function series(id: string): Series {
  const found = (ivSweepOption(input).series as Series[]).find((s) => s.id === id);
  if (found === undefined) throw new Error(`no series ${id}`);
  return found;
}

describe("currentUnit", () => {
  it("picks the largest unit in which the biggest current reads at least 1", () => {
    expect(currentUnit(774e-9).symbol).toBe("nA");
    expect(currentUnit(1e-6).symbol).toBe("µA");
    expect(currentUnit(0.2).symbol).toBe("mA");
    expect(currentUnit(3).symbol).toBe("A");
    expect(currentUnit(5e-14).symbol).toBe("pA");
    expect(currentUnit(0).symbol).toBe("nA");
  });
});

describe("ivSweepOption", () => {
  it("shades the thermal window from −V_w to +V_w in mV (12.926 mV at 300 K, w = 0.5)", () => {
    const [area] = series("measured").markArea?.data ?? [];
    expect(area?.[0]?.xAxis).toBeCloseTo(-12.926, 3);
    expect(area?.[1]?.xAxis).toBeCloseTo(12.926, 3);
    expect(area?.[0]?.name).toBe("Thermal window ±12.9 mV");
  });

  it("plots bias in mV and current in nA for a sweep that peaks at 52.5 nA, with the units on the axes", () => {
    const option = ivSweepOption(input);
    expect((option.xAxis as { name: string }).name).toBe("V (mV)");
    expect((option.yAxis as { name: string }).name).toBe("I (nA)");
    const [first] = series("measured").data;
    // −50 mV: I = 1 µS·(−0.05 V) + 2e-5 A/V³·(−0.05 V)³ = −50 nA − 2.5 nA = −52.5 nA
    expect(first?.[0]).toBeCloseTo(-50, 9);
    expect(first?.[1]).toBeCloseTo(-52.5, 9);
  });

  it("draws the linear fit G·V + I₀ from −V_w to +V_w", () => {
    const [left, right] = series("linear-fit").data;
    expect(left?.[0]).toBeCloseTo(-windowV * 1e3, 9);
    expect(right?.[1]).toBeCloseTo((g * windowV + 1e-10) * 1e9, 9);
  });

  it("draws the cubic dashed across the whole sweep", () => {
    const cubic = series("cubic-fit");
    expect(cubic.lineStyle?.type).toBe("dashed");
    expect(cubic.data[0]?.[0]).toBeCloseTo(-50, 9);
    expect(cubic.data[cubic.data.length - 1]?.[0]).toBeCloseTo(50, 9);
    // I(50 mV) = 50 nA + 2e-5 A/V³·1.25e-4 V³ = 52.5 nA
    expect(cubic.data[cubic.data.length - 1]?.[1]).toBeCloseTo(52.5, 9);
  });

  it("leaves the cubic out when there is none, and draws the window without points", () => {
    const option = ivSweepOption({ ...input, points: [], cubic: null });
    const ids = (option.series as Series[]).map((s) => s.id);
    expect(ids).toEqual(["measured", "linear-fit"]);
  });
});
