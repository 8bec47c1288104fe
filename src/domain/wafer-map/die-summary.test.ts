import { describe, expect, it } from "vitest";
import { CONDUCTANCE_QUANTUM_S } from "../transport/constants";
import { dieModes, dieSummaryRows, dieSummaryText } from "./die-summary";
import type { MapDie } from "./map-die";

const die: MapDie = {
  x: 3,
  y: -2,
  conductanceS: 12.34e-6,
  bin: "PASS",
  outOfWindow: false,
  inked: false,
  modes: 12.34e-6 / CONDUCTANCE_QUANTUM_S,
  nonlinearity: 0.004321,
  r2: 0.999912,
  pointsInWindow: 7,
  windowV: 0.012926,
  temperatureK: 300.15,
};

function valueOf(rows: { label: string; value: string }[], label: string): string | undefined {
  return rows.find((row) => row.label === label)?.value;
}

describe("dieSummaryRows", () => {
  it("prints G in the unit, G/G₀, η, R², points, V_w in mV and T in K", () => {
    const rows = dieSummaryRows(die, "µS");
    expect(valueOf(rows, "Die")).toBe("(3, -2)");
    expect(valueOf(rows, "G")).toBe("12.3 µS");
    // 12.34 µS / 77.48 µS = 0.1593
    expect(valueOf(rows, "G/G₀")).toBe("0.159");
    expect(valueOf(rows, "η")).toBe("0.00432");
    expect(valueOf(rows, "R²")).toBe("0.9999");
    expect(valueOf(rows, "Points in window")).toBe("7");
    expect(valueOf(rows, "V_w")).toBe("12.9 mV");
    expect(valueOf(rows, "T")).toBe("300.15 K");
    expect(valueOf(rows, "Flags")).toBeUndefined();
  });

  it("leaves out the G row when the unit is G₀, where it would repeat G/G₀", () => {
    const rows = dieSummaryRows(die, "G0");
    expect(valueOf(rows, "G")).toBeUndefined();
    expect(valueOf(rows, "G/G₀")).toBe("0.159");
  });

  it("names the out-of-window and inked flags", () => {
    expect(valueOf(dieSummaryRows({ ...die, outOfWindow: true, inked: true }, "S"), "Flags")).toBe("out of window, inked");
  });

  it("prints a dash for missing results", () => {
    const rows = dieSummaryRows({ ...die, bin: "NODATA", conductanceS: null, modes: null, nonlinearity: null, r2: null }, "µS");
    for (const label of ["G", "G/G₀", "η", "R²"]) expect(valueOf(rows, label)).toBe("—");
  });
});

describe("dieModes", () => {
  it("falls back to G / G₀ when the reported modes are missing", () => {
    expect(dieModes({ modes: null, conductanceS: 2 * CONDUCTANCE_QUANTUM_S })).toBeCloseTo(2, 12);
    expect(dieModes({ modes: null, conductanceS: null })).toBeNull();
  });
});

describe("dieSummaryText", () => {
  it("reads as one sentence for a screen reader", () => {
    expect(dieSummaryText(die, "µS")).toMatch(/^Die \(3, -2\), Bin PASS, G 12\.3 µS, /);
  });
});
