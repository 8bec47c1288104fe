import { describe, expect, it } from "vitest";
import {
  RULE_DESCRIPTIONS,
  type RuleCheck,
  evaluateRules,
  nelsonRule1,
  nelsonRule2,
  nelsonRule3,
  nelsonRule4,
  nelsonRule5,
  nelsonRule6,
  nelsonRule7,
  nelsonRule8,
  westernElectricRule1,
  westernElectricRule2,
  westernElectricRule3,
  westernElectricRule4,
} from "./rules";

// Hand-built sequences in σ units around centre 0 (σ = 1) unless stated; definitions as in the
// Western Electric handbook (1956) and Nelson (1984).
const repeat = (value: number, count: number) => Array.from({ length: count }, () => value);
const alternate = (amplitude: number, count: number) => Array.from({ length: count }, (_, i) => (i % 2 === 0 ? -amplitude : amplitude));

interface RuleCase {
  readonly name: string;
  readonly rules: readonly [string, RuleCheck][];
  readonly fires: readonly [string, readonly number[], readonly number[]][];
  readonly silent: readonly [string, readonly number[]][];
}

const CASES: readonly RuleCase[] = [
  {
    name: "one point beyond 3σ (WE1, N1)",
    rules: [["WE1", westernElectricRule1], ["N1", nelsonRule1]],
    fires: [["points at +3.2σ and −3.5σ", [0, 0.5, 3.2, 0, -3.5], [2, 4]]],
    silent: [["points at or inside ±3σ", [2.9, -2.99, 3, -3]]],
  },
  {
    name: "two of three beyond 2σ on one side (WE2, N5)",
    rules: [["WE2", westernElectricRule2], ["N5", nelsonRule5]],
    fires: [
      ["2.5 and 2.1 with a point between", [0, 2.5, 0.3, 2.1], [3]],
      ["two in a row at the very start", [2.5, 2.6, 0], [1]],
    ],
    silent: [["a gap of two points, then a point on the other side", [2.5, 0, 0, 2.5, 0, -2.5, 1.9]]],
  },
  {
    name: "four of five beyond 1σ on one side (WE3, N6)",
    rules: [["WE3", westernElectricRule3], ["N6", nelsonRule6]],
    fires: [["four above +1σ around one central point", [1.5, 1.2, 0, 1.1, 1.3], [4]]],
    silent: [
      ["one of the four on the other side", [1.5, 1.2, 0, -1.1, 1.3]],
      ["one of the four exactly on +1σ", [1.5, 1.2, 0, 1, 1.3]],
    ],
  },
  {
    name: "eight in a row on one side (WE4)",
    rules: [["WE4", westernElectricRule4]],
    fires: [["nine points just above the centre", repeat(0.1, 9), [7, 8]]],
    silent: [
      ["a point exactly on the centre line in the middle", [...repeat(0.1, 7), 0, ...repeat(0.1, 7)]],
      ["a non-finite point in the middle", [...repeat(0.1, 7), Number.NaN, ...repeat(0.1, 7)]],
    ],
  },
  {
    name: "nine in a row on one side (N2)",
    rules: [["N2", nelsonRule2]],
    fires: [["nine points just below the centre", repeat(-0.2, 9), [8]]],
    silent: [["eight below, then one above", [...repeat(-0.2, 8), 0.2]]],
  },
  {
    name: "six in a row steadily increasing or decreasing (N3)",
    rules: [["N3", nelsonRule3]],
    fires: [
      ["six rising points", [0, 0.1, 0.2, 0.3, 0.4, 0.5], [5]],
      ["seven falling points", [0.5, 0.4, 0.3, 0.2, 0.1, 0, -0.1], [5, 6]],
    ],
    silent: [
      ["a repeated value inside the climb", [0, 0.1, 0.2, 0.2, 0.3, 0.4]],
      ["only five rising points", [0, 0.1, 0.2, 0.3, 0.4]],
    ],
  },
  {
    name: "fourteen in a row alternating up and down (N4)",
    rules: [["N4", nelsonRule4]],
    fires: [["fourteen alternating points", alternate(0.5, 14), [13]]],
    silent: [
      ["thirteen alternating points", alternate(0.5, 13)],
      ["fourteen points with two steps down in a row in the middle", [...alternate(0.5, 7), -0.7, ...alternate(0.5, 6).map((x) => -x)]],
    ],
  },
  {
    name: "fifteen in a row within 1σ (N7)",
    rules: [["N7", nelsonRule7]],
    fires: [
      ["fifteen points at ±0.5σ", alternate(0.5, 15), [14]],
      ["a point exactly on 1σ still counts as within", [...alternate(0.5, 14), 1], [14]],
    ],
    silent: [["one of fifteen just beyond 1σ", [...alternate(0.5, 7), 1.01, ...alternate(0.5, 7)]]],
  },
  {
    name: "eight in a row beyond 1σ on either side (N8)",
    rules: [["N8", nelsonRule8]],
    fires: [["eight points at ±1.5σ", alternate(1.5, 8), [7]]],
    silent: [["one of eight exactly on 1σ", [...alternate(1.5, 4), 1, ...alternate(1.5, 3)]]],
  },
];

for (const ruleCase of CASES) {
  describe(ruleCase.name, () => {
    for (const [id, check] of ruleCase.rules) {
      for (const [label, values, indices] of ruleCase.fires) {
        it(`${id} fires at the completing point: ${label}`, () => {
          expect(check(values, 0, 1)).toEqual(indices);
        });
      }
      for (const [label, values] of ruleCase.silent) {
        it(`${id} stays silent: ${label}`, () => {
          expect(check(values, 0, 1)).toEqual([]);
        });
      }
    }
  });
}

describe("rule scaling and arguments", () => {
  it("reads zones from the given centre and σ", () => {
    expect(westernElectricRule1([100, 116], 100, 5)).toEqual([1]);
    expect(westernElectricRule1([100, 114], 100, 5)).toEqual([]);
    expect(westernElectricRule4(repeat(101, 8), 100, 5)).toEqual([7]);
  });

  it("treats any departure as beyond when σ = 0", () => {
    expect(westernElectricRule1([2, 2 + 1e-9], 2, 0)).toEqual([1]);
  });

  it("refuses a non-finite centre and a negative or non-finite σ", () => {
    expect(() => westernElectricRule1([1], Number.POSITIVE_INFINITY, 1)).toThrow(RangeError);
    expect(() => nelsonRule3([1], 0, -1)).toThrow(RangeError);
    expect(() => nelsonRule7([1], 0, Number.NaN)).toThrow(RangeError);
  });
});

describe("evaluateRules", () => {
  it("lists Western Electric violations by index, then rule number, with their descriptions", () => {
    // Index 2 (3.5σ) completes both one-beyond-3σ and two-of-three-beyond-2σ.
    expect(evaluateRules([0, 2.5, 3.5], 0, 1, "western-electric")).toEqual([
      { index: 2, rule: "WE1", description: RULE_DESCRIPTIONS.WE1 },
      { index: 2, rule: "WE2", description: RULE_DESCRIPTIONS.WE2 },
    ]);
  });

  it("uses Nelson numbering and adds the Nelson-only tests", () => {
    const violations = evaluateRules([0, 2.5, 3.5, 3.6, 3.7, 3.8], 0, 1, "nelson");
    expect(violations.filter((v) => v.index === 2).map((v) => v.rule)).toEqual(["N1", "N5"]);
    // 0 … 3.8 rises six times in a row, which only the Nelson set tests for.
    expect(violations.filter((v) => v.rule === "N3").map((v) => v.index)).toEqual([5]);
    expect(evaluateRules([0, 2.5, 3.5, 3.6, 3.7, 3.8], 0, 1, "western-electric").some((v) => v.rule === "N3")).toBe(false);
  });

  it("wires every rule id to its own test on a long drifting sequence", () => {
    let seed = 12345;
    const noise = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648 - 0.5) * 3;
    const values = Array.from({ length: 300 }, (_, i) => noise() + (i > 200 ? 1.5 : 0));
    const checks: Record<string, RuleCheck> = {
      N1: nelsonRule1, N2: nelsonRule2, N3: nelsonRule3, N4: nelsonRule4,
      N5: nelsonRule5, N6: nelsonRule6, N7: nelsonRule7, N8: nelsonRule8,
    };
    const violations = evaluateRules(values, 0, 1, "nelson");
    for (const [rule, check] of Object.entries(checks)) {
      expect(violations.filter((v) => v.rule === rule).map((v) => v.index)).toEqual(check(values, 0, 1));
    }
    expect(violations.length).toBeGreaterThan(0);
  });

  it("returns nothing for an empty chart", () => {
    expect(evaluateRules([], 0, 1, "nelson")).toEqual([]);
  });
});
