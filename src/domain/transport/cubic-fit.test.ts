import regression from "regression";
import { describe, expect, it } from "vitest";
import { fitCubic, nonlinearityIndex } from "./cubic-fit";
import { range, relErr, seeded, sweep } from "./test-sweeps";

describe("fitCubic against the independent reference npm `regression` (polynomial, order 3)", () => {
  it("agrees on all four coefficients for random noisy data", () => {
    const random = seeded(3);
    for (let trial = 0; trial < 20; trial++) {
      const c = [random() - 0.5, 2 * random() - 1, random() - 0.5, random() - 0.5];
      const points = sweep(
        Array.from({ length: 8 + trial }, () => 2 * random() - 1),
        (v) => (c[0] as number) + (c[1] as number) * v + (c[2] as number) * v * v + (c[3] as number) * v ** 3 + 0.1 * (random() - 0.5),
      );
      const ours = fitCubic(points);
      // regression's polynomial equation lists the highest power first: [a₃, a₂, a₁, a₀].
      const [a3, a2, a1, a0] = regression.polynomial(points.map((p) => [p.biasV, p.currentA]), { order: 3, precision: 15 }).equation;
      expect(Math.abs((ours?.cubicAPerV3 ?? 0) - (a3 as number))).toBeLessThan(1e-9);
      expect(Math.abs((ours?.quadraticAPerV2 ?? 0) - (a2 as number))).toBeLessThan(1e-9);
      expect(Math.abs((ours?.conductanceS ?? 0) - (a1 as number))).toBeLessThan(1e-9);
      expect(Math.abs((ours?.offsetA ?? 0) - (a0 as number))).toBeLessThan(1e-9);
    }
  });
});

describe("fitCubic", () => {
  it("recovers an exact cubic in probe units (mV sweep, nA currents, µA offset) to 1e−8 relative", () => {
    const [i0, g1, a2, a3] = [2e-6, 7.7e-5, -3e-4, 0.9];
    const fit = fitCubic(sweep(range(-0.05, 0.03, 0.005), (v) => i0 + g1 * v + a2 * v * v + a3 * v ** 3));
    expect(relErr(fit?.offsetA ?? 0, i0)).toBeLessThan(1e-10);
    expect(relErr(fit?.conductanceS ?? 0, g1)).toBeLessThan(1e-9);
    expect(relErr(fit?.quadraticAPerV2 ?? 0, a2)).toBeLessThan(1e-8);
    expect(relErr(fit?.cubicAPerV3 ?? 0, a3)).toBeLessThan(1e-8);
  });

  it("returns null below 5 distinct biases or on a non-finite value", () => {
    expect(fitCubic(sweep([-2, -1, 0, 1, 1, 1], (v) => v))).toBeNull();
    expect(fitCubic(sweep([-2, -1, 0, 1, 2], (v) => v))).not.toBeNull();
    expect(fitCubic(sweep([-2, -1, 0, 1, 2, Number.POSITIVE_INFINITY], (v) => v))).toBeNull();
  });
});

describe("nonlinearityIndex", () => {
  it("is (|a₂|·V_w + |a₃|·V_w²)/|G₁|, 0 for a straight line and Infinity for a curve with G₁ = 0", () => {
    const cubic = { offsetA: 0, conductanceS: -2e-5, quadraticAPerV2: 1e-4, cubicAPerV3: -3e-3, n: 9 };
    expect(relErr(nonlinearityIndex(cubic, 0.01), (1e-4 * 0.01 + 3e-3 * 1e-4) / 2e-5)).toBeLessThan(1e-14);
    expect(nonlinearityIndex({ ...cubic, quadraticAPerV2: 0, cubicAPerV3: 0 }, 0.01)).toBe(0);
    expect(nonlinearityIndex({ ...cubic, conductanceS: 0 }, 0.01)).toBe(Number.POSITIVE_INFINITY);
  });
});
