import { describe, expect, it } from "vitest";
import { gaussLegendreRule, integrate } from "./quadrature";

describe("gaussLegendreRule", () => {
  it("gives the closed-form 2- and 3-point rules: ±1/√3 with weights 1; 0, ±√(3/5) with 8/9, 5/9", () => {
    const two = gaussLegendreRule(2);
    expect(two.nodes[0]).toBeCloseTo(-1 / Math.sqrt(3), 15);
    expect(two.nodes[1]).toBeCloseTo(1 / Math.sqrt(3), 15);
    expect(two.weights[0]).toBeCloseTo(1, 15);
    const three = gaussLegendreRule(3);
    expect(three.nodes[1]).toBeCloseTo(0, 15);
    expect(three.nodes[2]).toBeCloseTo(Math.sqrt(3 / 5), 15);
    expect(three.weights[1]).toBeCloseTo(8 / 9, 15);
    expect(three.weights[2]).toBeCloseTo(5 / 9, 15);
  });

  it("integrates every monomial up to degree 2m − 1 exactly and misses degree 2m", () => {
    const m = 10;
    const { nodes, weights } = gaussLegendreRule(m);
    const apply = (degree: number) => nodes.reduce((sum, x, i) => sum + (weights[i] ?? 0) * x ** degree, 0);
    for (let degree = 0; degree < 2 * m; degree++) {
      const exact = degree % 2 === 0 ? 2 / (degree + 1) : 0;
      expect(apply(degree)).toBeCloseTo(exact, 13);
    }
    expect(Math.abs(apply(2 * m) - 2 / (2 * m + 1))).toBeGreaterThan(1e-8);
  });

  it("refuses a rule with fewer than one point or a fractional count", () => {
    expect(() => gaussLegendreRule(0)).toThrow(RangeError);
    expect(() => gaussLegendreRule(2.5)).toThrow(RangeError);
  });
});

describe("integrate", () => {
  it("integrates eˣ over [0, 1] to e − 1 and the normal density over ±8 to 1 within 1e-14", () => {
    expect(integrate(Math.exp, 0, 1)).toBeCloseTo(Math.E - 1, 14);
    const density = (x: number) => Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI);
    expect(integrate(density, -8, 8)).toBeCloseTo(1, 14);
  });

  it("changes sign when the limits are swapped and gives 0 on an empty interval", () => {
    expect(integrate(Math.sin, Math.PI, 0)).toBeCloseTo(-2, 14);
    expect(integrate(Math.sin, 1, 1)).toBe(0);
  });
});
