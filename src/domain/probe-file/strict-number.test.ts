import { describe, expect, it } from "vitest";
import { parseStrictNumber } from "./strict-number";

describe("parseStrictNumber", () => {
  it("reads plain decimals and scientific notation", () => {
    expect(parseStrictNumber("-774.2")).toBe(-774.2);
    expect(parseStrictNumber("1.2e-9")).toBe(1.2e-9);
    expect(parseStrictNumber("-1.0E-2")).toBe(-0.01);
    expect(parseStrictNumber("+5")).toBe(5);
    expect(parseStrictNumber(".5")).toBe(0.5);
    expect(parseStrictNumber("0")).toBe(0);
    expect(parseStrictNumber("0.25")).toBe(0.25);
  });

  it("allows white space around the number", () => {
    expect(parseStrictNumber("  12.5 ")).toBe(12.5);
    expect(parseStrictNumber("\t-3")).toBe(-3);
    expect(parseStrictNumber("7 ")).toBe(7);
  });

  it("rejects empty and blank cells instead of reading them as 0", () => {
    expect(parseStrictNumber("")).toBeNaN();
    expect(parseStrictNumber("   ")).toBeNaN();
    expect(parseStrictNumber(undefined)).toBeNaN();
  });

  it("rejects text, infinities, decimal commas and the hex, octal and binary forms Number() accepts", () => {
    for (const cell of ["abc", "1e", "NaN", "Infinity", "-Infinity", "1e999", "1,5", "1 2", "0x10", " 0X1f", "0o7", "0b11", "1_000"]) {
      expect(parseStrictNumber(cell), cell).toBeNaN();
    }
  });
});
