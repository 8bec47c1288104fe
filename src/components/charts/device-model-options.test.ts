import { describe, expect, it } from "vitest";
import { curves } from "@/domain/device-model";
import { CONDUCTANCE_QUANTUM_S } from "@/domain/transport/constants";
import { energyWindowOption, expectedCurveOption } from "./device-model-options";

describe("device-model chart options", () => {
  const c = curves({ kind: "step", modes: 4, transmission: 0.92, edgeEv: -0.0776 }, 0, 300.15);

  it("plots G(E) in units of G₀ and F_T in 1/eV on one energy axis in meV around μ", () => {
    const option = energyWindowOption(c) as { series: { data: [number, number][] }[] };
    const [g, ft] = option.series;
    expect(g!.data.at(-1)![1]).toBeCloseTo(4 * 0.92, 9); // far above the edge: M𝒯 modes
    const peak = Math.max(...ft!.data.map((p) => p[1]));
    const kTeV = (1.380649e-23 * 300.15) / 1.602176634e-19;
    expect(peak).toBeCloseTo(1 / (4 * kTeV), 6); // F_T peak 1/4kT (§5)
    expect(ft!.data.find((p) => p[1] === peak)![0]).toBeCloseTo(0, 9);
  });

  it("adds measured lot medians beside the expected curve when given", () => {
    const option = expectedCurveOption(c.temperature.map((p) => [p.temperatureK, p.modes]), "T (K)", undefined, [[300.15, (3.5 * CONDUCTANCE_QUANTUM_S) / CONDUCTANCE_QUANTUM_S]]) as { series: { name: string }[] };
    expect(option.series.map((s) => s.name)).toEqual(["expected G", "measured lot medians"]);
  });
});
