import { describe, expect, it } from "vitest";
import { CONDUCTANCE_QUANTUM_S, thermalVoltageV } from "./constants";
import { fitCubic, nonlinearityIndex } from "./cubic-fit";
import type { StepDeviceModel } from "./device-model";
import { fitLinearResponse } from "./linear-fit";
import { analyzeDie, analyzeDieArrays, BINS, DEFAULT_EXTRACTION, type ExtractionSettings, type IvPoint } from "./linear-response";
import { stepConductanceClosedFormS, stepCurrentClosedFormA } from "./step-closed-form";
import { range, relErr, sweep } from "./test-sweeps";

const step: StepDeviceModel = { kind: "step", modes: 4, transmission: 0.9, edgeEv: 0 };
const mv = (from: number, to: number, by: number) => range(from, to, by).map((x) => x / 1000);
/** An ohmic die of 10 µS with a 1 nA offset, swept ±10 mV in 1 mV steps (inside V_w = 12.9 mV at 300 K). */
const ohmic = sweep(mv(-10, 10, 1), (v) => 1e-5 * v + 1e-9);
const settings = (overrides: Partial<ExtractionSettings>): ExtractionSettings => ({ ...DEFAULT_EXTRACTION, ...overrides });

describe("BINS and DEFAULT_EXTRACTION", () => {
  it("list the bins in §5 first-match order and the §5 defaults", () => {
    expect(BINS).toEqual(["NODATA", "SHORT", "OPEN", "NONLINEAR", "LOW", "HIGH", "PASS"]);
    expect(DEFAULT_EXTRACTION).toEqual({ windowFactor: 0.5, nonlinearityMax: 0.02, openBelowS: null, shortAboveS: null, specLowS: null, specHighS: null });
  });
});

describe("analyzeDie on the §8 closed-form current of a step", () => {
  const lowBias = (temperatureK: number, fermiLevelEv: number) => {
    const kT = thermalVoltageV(temperatureK);
    return sweep(range(-10, 10, 1).map((i) => (i / 10) * 0.2 * kT), (v) => stepCurrentClosedFormA(step, fermiLevelEv, v, temperatureK));
  };

  it("returns the linear-response G to 1e−4 at |V| ≤ 0.2 kT/q with μ at or above the edge, and PASSes", () => {
    for (const temperatureK of [77, 300]) {
      for (const aboveEdgeKt of [0, 4, 8, 20]) {
        const fermiLevelEv = step.edgeEv + aboveEdgeKt * thermalVoltageV(temperatureK);
        const result = analyzeDie(lowBias(temperatureK, fermiLevelEv), DEFAULT_EXTRACTION, temperatureK);
        expect(relErr(result.conductanceS ?? 0, stepConductanceClosedFormS(step, fermiLevelEv, temperatureK))).toBeLessThan(1e-4);
        expect(result.bin).toBe("PASS");
        expect(result.reason).toBeNull();
        expect(result.pointsInWindow).toBe(21);
      }
    }
  });

  it("is off by exactly Σ d·sinh d / Σ d² (d = qV/2kT) in the non-degenerate limit, ≈ 1.1e−3 at 0.2 kT/q", () => {
    // Far below the edge I ∝ sinh(qV/2kT), so the OLS slope over the sweep exceeds G by this ratio.
    const temperatureK = 300;
    const kT = thermalVoltageV(temperatureK);
    const fermiLevelEv = step.edgeEv - 20 * kT;
    const points = lowBias(temperatureK, fermiLevelEv);
    const d = points.map((p) => p.biasV / (2 * kT));
    const ratio = d.reduce((s, x) => s + x * Math.sinh(x), 0) / d.reduce((s, x) => s + x * x, 0);
    const result = analyzeDie(points, DEFAULT_EXTRACTION, temperatureK);
    expect(relErr((result.conductanceS ?? 0) / stepConductanceClosedFormS(step, fermiLevelEv, temperatureK), ratio)).toBeLessThan(1e-8);
    expect(ratio - 1).toBeGreaterThan(1e-3);
    expect(result.bin).toBe("PASS");
  });

  it("bins NONLINEAR when the same device with μ 5 kT below the edge is swept to ±10 kT/q", () => {
    const temperatureK = 300;
    const kT = thermalVoltageV(temperatureK);
    const points = sweep(range(-20, 20, 1).map((i) => (i / 2) * kT), (v) => stepCurrentClosedFormA(step, step.edgeEv - 5 * kT, v, temperatureK));
    const result = analyzeDie(points, DEFAULT_EXTRACTION, temperatureK);
    expect(result.bin).toBe("NONLINEAR");
    expect(result.nonlinearity ?? 0).toBeGreaterThan(0.02);
    expect(result.nonlinearityWindowOnly).toBe(false);
    expect(result.reason).toMatch(/^nonlinearity η = [\d.]+ above η_max 0\.02$/);
  });
});

describe("analyzeDie NODATA", () => {
  it("names the counts when too few distinct biases fall in the window (77 K, 5 mV steps, V_w = 3.32 mV)", () => {
    const result = analyzeDie(sweep(mv(-50, 50, 5), (v) => 1e-5 * v), DEFAULT_EXTRACTION, 77);
    expect(result.bin).toBe("NODATA");
    expect(result.windowV).toBeCloseTo(0.0033177, 6);
    expect(result.pointsInWindow).toBe(1);
    expect(result.reason).toBe("1 distinct bias within ±3.32 mV (need 3)");
    expect(result.conductanceS).toBeNull();
    expect(result.modes).toBeNull();
  });

  it("does not count repeated biases as distinct", () => {
    const result = analyzeDie(sweep([-0.005, -0.005, 0.005, 0.005, 0.005], (v) => 1e-5 * v), DEFAULT_EXTRACTION, 300);
    expect(result.reason).toBe("2 distinct biases within ±12.9 mV (need 3)");
    expect(result.pointsInWindow).toBe(5);
  });

  it("refuses any non-finite bias or current, naming the point", () => {
    const points = ohmic.map((p, i) => (i === 2 ? { ...p, currentA: Number.NaN } : p));
    expect(analyzeDie(points, DEFAULT_EXTRACTION, 300)).toMatchObject({ bin: "NODATA", reason: "non-finite bias or current at point 3" });
    const infiniteBias = ohmic.map((p, i) => (i === 0 ? { ...p, biasV: Number.NEGATIVE_INFINITY } : p));
    expect(analyzeDie(infiniteBias, DEFAULT_EXTRACTION, 300).bin).toBe("NODATA");
  });

  it("refuses a negative G beyond noise (|G| > 3 standard errors) but keeps one within noise", () => {
    const reversed = analyzeDie(sweep(mv(-10, 10, 1), (v) => -2e-6 * v), DEFAULT_EXTRACTION, 300);
    expect(reversed.bin).toBe("NODATA");
    expect(reversed.reason).toMatch(/^G = -2 µS is negative beyond noise \(3σ = .+S\)$/);
    // A slope of −1 nS under ±50 nA alternating noise: the standard error is far above 1 nS.
    const noisy = analyzeDie(sweep(mv(-10, 10, 1), (v) => -1e-9 * v + (Math.round(v * 1000) % 2 === 0 ? 5e-8 : -5e-8)), DEFAULT_EXTRACTION, 300);
    expect(noisy.conductanceS ?? 0).toBeLessThan(0);
    expect(noisy.bin).not.toBe("NODATA");
  });

  it("refuses an unusable temperature", () => {
    expect(analyzeDie(ohmic, DEFAULT_EXTRACTION, -1)).toMatchObject({ bin: "NODATA", reason: "temperature -1 K is not usable" });
    expect(analyzeDie(ohmic, DEFAULT_EXTRACTION, Number.NaN).bin).toBe("NODATA");
  });
});

describe("analyzeDie bins and thresholds", () => {
  it("PASSes an ohmic die and reports G, I₀, R², n, V_w and modes = G/G₀", () => {
    const result = analyzeDie(ohmic, DEFAULT_EXTRACTION, 300);
    expect(result.bin).toBe("PASS");
    expect(relErr(result.conductanceS ?? 0, 1e-5)).toBeLessThan(1e-12);
    expect(relErr(result.offsetA ?? 0, 1e-9)).toBeLessThan(1e-9);
    expect(result.r2).toBeCloseTo(1, 12);
    expect(result.pointsInWindow).toBe(21);
    expect(result.windowV).toBe(0.5 * thermalVoltageV(300));
    expect(result.modes).toBe((result.conductanceS ?? 0) / CONDUCTANCE_QUANTUM_S);
    expect(result.temperatureK).toBe(300);
    expect(result.conductanceS).toBe(fitLinearResponse(ohmic, result.windowV)?.conductanceS);
  });

  it("counts modes in units of G₀ = 2q²/h", () => {
    const twoModes = analyzeDie(sweep(mv(-10, 10, 2), (v) => 2 * CONDUCTANCE_QUANTUM_S * v), DEFAULT_EXTRACTION, 300);
    expect(twoModes.modes).toBeCloseTo(2, 12);
  });

  it("bins SHORT on any compliance point, whatever G", () => {
    const clipped = ohmic.map((p, i) => (i === 20 ? { ...p, compliance: true } : p));
    expect(analyzeDie(clipped, settings({ openBelowS: 1 }), 300)).toMatchObject({ bin: "SHORT", reason: "1 point at the compliance limit" });
  });

  it("applies each threshold with a strict comparison and a reason naming G and the limit", () => {
    expect(analyzeDie(ohmic, settings({ shortAboveS: 5e-6 }), 300)).toMatchObject({ bin: "SHORT", reason: "G = 10 µS above the short threshold 5 µS" });
    expect(analyzeDie(ohmic, settings({ openBelowS: 2e-5 }), 300)).toMatchObject({ bin: "OPEN", reason: "G = 10 µS below the open threshold 20 µS" });
    expect(analyzeDie(ohmic, settings({ specLowS: 1.2e-5 }), 300)).toMatchObject({ bin: "LOW", reason: "G = 10 µS below the spec low limit 12 µS" });
    expect(analyzeDie(ohmic, settings({ specHighS: 8e-6 }), 300)).toMatchObject({ bin: "HIGH", reason: "G = 10 µS above the spec high limit 8 µS" });
    const g = analyzeDie(ohmic, DEFAULT_EXTRACTION, 300).conductanceS ?? 0;
    const atEveryLimit = settings({ shortAboveS: g, openBelowS: g, specLowS: g, specHighS: g });
    expect(analyzeDie(ohmic, atEveryLimit, 300)).toMatchObject({ bin: "PASS", reason: null });
  });

  it("takes the first matching bin in §5 order", () => {
    const all = settings({ shortAboveS: 1e-6, openBelowS: 1, specLowS: 1, specHighS: 1e-7 });
    expect(analyzeDie(ohmic, all, 300).bin).toBe("SHORT");
    expect(analyzeDie(ohmic, { ...all, shortAboveS: null }, 300).bin).toBe("OPEN");
    const curved = sweep(mv(-50, 50, 5), (v) => 1e-5 * v * (1 + 4 * v));
    expect(analyzeDie(curved, settings({ specLowS: 1 }), 300).bin).toBe("NONLINEAR");
    expect(analyzeDie(ohmic, settings({ specLowS: 1, specHighS: 1e-7 }), 300).bin).toBe("LOW");
  });
});

describe("analyzeDie nonlinearity", () => {
  // I = G·V·(1 + βV) has a₂ = Gβ, a₃ = 0, so η = β·V_w exactly; β = 4 /V gives η = 0.0517 at 300 K.
  const beta = 4;
  const windowV = 0.5 * thermalVoltageV(300);

  it("takes η from the whole sweep when it leaves the window", () => {
    const points = sweep(mv(-50, 50, 5), (v) => 1e-5 * v * (1 + beta * v));
    const result = analyzeDie(points, DEFAULT_EXTRACTION, 300);
    expect(relErr(result.nonlinearity ?? 0, beta * windowV)).toBeLessThan(1e-8);
    const cubic = fitCubic(points);
    if (cubic === null) throw new Error("fitCubic refused a 21-point sweep");
    expect(result.nonlinearity).toBe(nonlinearityIndex(cubic, windowV));
    expect(result.nonlinearityWindowOnly).toBe(false);
    expect(result.bin).toBe("NONLINEAR");
  });

  it("takes η from the window points and says so when the sweep never leaves the window", () => {
    const result = analyzeDie(sweep(mv(-12, 12, 2), (v) => 1e-5 * v * (1 + beta * v)), DEFAULT_EXTRACTION, 300);
    expect(relErr(result.nonlinearity ?? 0, beta * windowV)).toBeLessThan(1e-8);
    expect(result.nonlinearityWindowOnly).toBe(true);
    expect(result.reason).toContain("from the window points only");
  });

  it("reports no η (and does not bin NONLINEAR) below 5 distinct biases", () => {
    const result = analyzeDie(sweep([-0.005, 0, 0.005, 0.03, 0.005, 0], (v) => 1e-5 * v * (1 + 40 * v)), DEFAULT_EXTRACTION, 300);
    expect(result.nonlinearity).toBeNull();
    expect(result.nonlinearityWindowOnly).toBe(false);
    expect(result.bin).toBe("PASS");
  });
});

describe("analyzeDieArrays", () => {
  it("reads only the first n entries and agrees with analyzeDie", () => {
    const points: IvPoint[] = ohmic.map((p, i) => (i === 3 ? { ...p, compliance: true } : p));
    const n = points.length;
    const bias = new Float64Array(n + 5).fill(Number.NaN);
    const current = new Float64Array(n + 5).fill(Number.NaN);
    const compliance = new Uint8Array(n + 5).fill(1);
    points.forEach((p, i) => {
      bias[i] = p.biasV;
      current[i] = p.currentA;
      compliance[i] = p.compliance ? 1 : 0;
    });
    const fromArrays = analyzeDieArrays(bias, current, compliance, n, DEFAULT_EXTRACTION, 300);
    expect(fromArrays).toEqual(analyzeDie(points, DEFAULT_EXTRACTION, 300));
    expect(fromArrays.bin).toBe("SHORT");
  });

  it("keeps results independent between consecutive dies (no state carried over)", () => {
    const first = analyzeDie(ohmic, DEFAULT_EXTRACTION, 300);
    analyzeDie(sweep(mv(-50, 50, 5), (v) => 3e-3 * v + 1), DEFAULT_EXTRACTION, 77);
    expect(analyzeDie(ohmic, DEFAULT_EXTRACTION, 300)).toEqual(first);
  });
});
