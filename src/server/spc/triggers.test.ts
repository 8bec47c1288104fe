import { describe, expect, it } from "vitest";
import { lotTriggers } from "./triggers";

const quiet = { lot: "L1", product: "P", hits: [], yieldFloor: { floor: 0.8, lotYield: 0.9, broken: false }, edge: [] };

describe("lotTriggers", () => {
  it("raises nothing for a lot in control, above its floor and without a ring", () => {
    expect(lotTriggers(quiet)).toEqual([]);
  });

  it("raises one rule trigger naming every rule and the wafers involved", () => {
    const hits = [
      { chart: "Individuals", wafer: 3, rule: "WE3", description: "d", value: 1 },
      { chart: "Individuals", wafer: 1, rule: "WE3", description: "d", value: 1 },
      { chart: "Lot X̄–S", wafer: null, rule: "WE2", description: "d", value: 1 },
    ];
    const [raised] = lotTriggers({ ...quiet, hits });
    expect(raised).toMatchObject({ trigger: "rule", wafers: [1, 3], title: "P: control rule WE3, WE2 broken at lot L1" });
    expect(raised?.findings).toHaveLength(3);
  });

  it("raises the yield floor and an edge ring with their figures", () => {
    const edge = [
      { wafer: 2, edgeYield: 0.5, centreYield: 0.95, gap: 0.45, edgeTested: 40, ring: true },
      { wafer: 4, edgeYield: 0.9, centreYield: 0.95, gap: 0.05, edgeTested: 40, ring: false },
    ];
    const raised = lotTriggers({ ...quiet, yieldFloor: { floor: 0.8, lotYield: 0.625, broken: true }, edge });
    expect(raised.map((r) => r.trigger)).toEqual(["yield_floor", "edge_ring"]);
    expect(raised[0]?.title).toBe("P: lot L1 yield 62.5 % under the floor of 80.0 %");
    expect(raised[1]?.wafers).toEqual([2]);
  });
});
