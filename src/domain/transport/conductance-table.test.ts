import { describe, expect, it } from "vitest";
import { DeviceModelTableError, parseConductanceTable } from "./conductance-table";

function refusal(text: string): DeviceModelTableError {
  try {
    parseConductanceTable(text);
  } catch (error) {
    if (error instanceof DeviceModelTableError) return error;
    throw error;
  }
  throw new Error("the table was accepted");
}

describe("parseConductanceTable", () => {
  it("reads comma-separated rows with an optional header and scientific notation", () => {
    expect(parseConductanceTable("energy_ev,conductance_s\n-0.1,0\n0.05,7.75e-5\n0.2,1.55E-4\n").points).toEqual([
      [-0.1, 0],
      [0.05, 7.75e-5],
      [0.2, 1.55e-4],
    ]);
    expect(parseConductanceTable("0,1e-6\n1,2e-6").points).toEqual([[0, 1e-6], [1, 2e-6]]);
  });

  it("accepts semicolons, tabs, CRLF, a BOM, blank lines and an upper-case header", () => {
    const expected = [[0, 1e-6], [0.5, 3e-6]];
    expect(parseConductanceTable("\uFEFFEnergy_eV;Conductance_S\r\n0;1e-6\r\n0.5;3e-6\r\n").points).toEqual(expected);
    expect(parseConductanceTable("0\t1e-6\n\n0.5\t3e-6\n\n").points).toEqual(expected);
  });

  it("refuses a non-numeric value with its 1-based line, counting the header and blank lines", () => {
    const error = refusal("energy_ev,conductance_s\n0,1e-6\n\n0.2,abc\n");
    expect(error.line).toBe(4);
    expect(error.message).toContain('"abc" is not a number');
    expect(refusal("0,1e-6\n0x10,2e-6").line).toBe(2);
    expect(refusal("0,1e-6\n0.1,").message).toContain("not a number");
  });

  it("refuses non-finite values", () => {
    expect(refusal("0,1e-6\n0.1,Infinity").message).toContain("not finite");
    expect(refusal("0,1e-6\nNaN,1e-6").line).toBe(2);
    expect(refusal("0,1e-6\n0.1,1e999").message).toContain("not finite");
  });

  it("refuses energies that do not strictly increase", () => {
    const error = refusal("0,1e-6\n0.1,2e-6\n0.1,3e-6");
    expect(error.line).toBe(3);
    expect(error.message).toContain("strictly increase");
    expect(refusal("0.2,1e-6\n0.1,2e-6").line).toBe(2);
  });

  it("refuses a negative conductance", () => {
    const error = refusal("0,1e-6\n0.1,-2e-6");
    expect(error.line).toBe(2);
    expect(error.message).toContain("negative");
  });

  it("refuses fewer than 2 points, a header alone and an empty text", () => {
    expect(refusal("0,1e-6\n").message).toContain("at least 2 points, found 1");
    expect(refusal("energy_ev,conductance_s\n").line).toBe(1);
    expect(refusal("").line).toBe(1);
  });

  it("refuses rows without exactly two values and a header that is not on the first line", () => {
    expect(refusal("0,1e-6,3\n1,2e-6").message).toContain("expected 2 values");
    expect(refusal("0,1e-6\nenergy_ev,conductance_s\n1,2e-6").line).toBe(2);
  });
});
