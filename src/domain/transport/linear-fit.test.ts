import regression from "regression";
import { describe, expect, it } from "vitest";
import { fitLinearResponse } from "./linear-fit";
import { range, relErr, seeded, sweep } from "./test-sweeps";

describe("fitLinearResponse against the independent reference npm `regression` (linear)", () => {
  it("agrees on slope, intercept and R² for random noisy data", () => {
    const random = seeded(7);
    for (let trial = 0; trial < 20; trial++) {
      const slope = 4 * random() - 2;
      const intercept = random() - 0.5;
      const points = sweep(
        Array.from({ length: 5 + trial }, () => 2 * random() - 1),
        (v) => slope * v + intercept + 0.2 * (random() - 0.5),
      );
      const ours = fitLinearResponse(points, 1);
      const reference = regression.linear(points.map((p) => [p.biasV, p.currentA]), { precision: 15 });
      expect(ours).not.toBeNull();
      expect(Math.abs((ours?.conductanceS ?? 0) - (reference.equation[0] as number))).toBeLessThan(1e-12);
      expect(Math.abs((ours?.offsetA ?? 0) - (reference.equation[1] as number))).toBeLessThan(1e-12);
      expect(Math.abs((ours?.r2 ?? 0) - reference.r2)).toBeLessThan(1e-12);
    }
  });
});

describe("fitLinearResponse", () => {
  it("gives the textbook slope standard error √(SS_res/(n − 2)/Σ(V − V̄)²)", () => {
    const random = seeded(11);
    const points = sweep(range(-0.01, 0.01, 0.002), (v) => 3e-5 * v + 2e-9 + 1e-9 * (random() - 0.5));
    const fit = fitLinearResponse(points, 0.02);
    const n = points.length;
    const meanV = points.reduce((s, p) => s + p.biasV, 0) / n;
    const sxx = points.reduce((s, p) => s + (p.biasV - meanV) ** 2, 0);
    const ssRes = points.reduce((s, p) => s + (p.currentA - ((fit?.conductanceS ?? 0) * p.biasV + (fit?.offsetA ?? 0))) ** 2, 0);
    expect(fit?.n).toBe(n);
    expect(relErr(fit?.slopeStdErrS ?? 0, Math.sqrt(ssRes / (n - 2) / sxx))).toBeLessThan(1e-8);
  });

  it("uses only points with |V| ≤ V_w and keeps precision under a large offset", () => {
    const inside = (v: number) => 5e-6 * v + 1e-3;
    const points = sweep(range(-0.02, 0.02, 0.001), (v) => (Math.abs(v) < 0.0055 ? inside(v) : 1));
    const fit = fitLinearResponse(points, 0.0055);
    expect(fit?.n).toBe(11);
    expect(relErr(fit?.conductanceS ?? 0, 5e-6)).toBeLessThan(1e-9);
    expect(relErr(fit?.offsetA ?? 0, 1e-3)).toBeLessThan(1e-12);
  });

  it("returns null below 3 distinct in-window biases, however many repeats", () => {
    expect(fitLinearResponse(sweep([-0.001, -0.001, 0.001, 0.001, 0.001, 0.05], (v) => v), 0.01)).toBeNull();
    expect(fitLinearResponse(sweep([-0.001, 0, 0.001], (v) => v), 0.01)).not.toBeNull();
  });

  it("returns null on a non-finite value and gives a null R² for currents without spread", () => {
    expect(fitLinearResponse(sweep([-0.001, 0, 0.001, Number.NaN], (v) => v), 0.01)).toBeNull();
    expect(fitLinearResponse(sweep([-0.001, 0, 0.001], () => 2e-9), 0.01)?.r2).toBeNull();
  });
});
