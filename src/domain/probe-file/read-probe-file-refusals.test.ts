import { describe, expect, it } from "vitest";
import { ProbeFileError } from "./probe-file-error";
import { fixtureBytes, oneChunk, probeText, readAll, tinyChunks } from "./probe-file-test-support";
import { readProbeFile } from "./read-probe-file";

const HEADER = "wafer,die_x,die_y,bias_mv,current_na";

/** n good rows of one die each 11 points (die_x steps every 11 rows), with `bad` replacing the rows at those indices. */
function rowsWith(n: number, bad: Record<number, string> = {}): string[] {
  return Array.from({ length: n }, (_, i) => bad[i] ?? `1,${Math.floor(i / 11)},0,${(i % 11) * 2 - 10},${((i % 11) * 2 - 10) * 1.5}`);
}

const REFUSALS = [
  ["missing-column.csv", "missing_column", 3, "line 3: the header has no die_y column"],
  ["unknown-unit.csv", "unknown_unit", 4, 'line 4: column "bias_kv" has an unknown unit "kv"; expected bias_v, bias_mv or bias_uv'],
  ["non-numeric.csv", "bad_value", 9, 'line 9: current_na is not a number ("abc"); 1 bad row of 12 exceeds the error budget of 0.1 %'],
  ["wafer-out-of-range.csv", "wafer_range", 16, 'line 16: wafer is not an integer in 1–25 ("26"); 1 bad row of 12 exceeds the error budget of 0.1 %'],
  ["two-temperatures.csv", "mixed_temperature", 11, "line 11: die (wafer 1, x 0, y 0) has points at 350.15 K here and 300.15 K on line 5"],
] as const;

describe("readProbeFile refusals on the fixtures", () => {
  it.each(REFUSALS)("refuses %s with %s on line %i", async (name, code, line, message) => {
    const { error } = await readAll(oneChunk(fixtureBytes(name)));
    expect(error).toBeInstanceOf(ProbeFileError);
    expect({ code: error?.code, line: error?.line, message: error?.message }).toEqual({ code, line, message });
  });

  it.each(REFUSALS)("refuses %s identically when it arrives in chunks of 1–7 bytes", async (name) => {
    const whole = await readAll(oneChunk(fixtureBytes(name)));
    const tiny = await readAll(tinyChunks(fixtureBytes(name)));
    expect(tiny.error?.message).toBe(whole.error?.message);
    expect(tiny.error?.line).toBe(whole.error?.line);
  });

  it("refuses under CRLF and a BOM with the same line numbers", async () => {
    const crlf = "\uFEFF" + new TextDecoder().decode(fixtureBytes("non-numeric.csv")).replace(/\n/g, "\r\n");
    const { error } = await readAll(tinyChunks(new TextEncoder().encode(crlf)));
    expect(error?.line).toBe(9);
    expect(error?.code).toBe("bad_value");
  });
});

describe("readProbeFile error budget (§4: default 0.1 % of rows)", () => {
  it("passes one bad row in 2,000, skipping it with a warning", async () => {
    const { error, summary, fragments } = await readAll(oneChunk(probeText(HEADER, rowsWith(2000, { 1000: "1,90,0,-8,n/a" }))));
    expect(error).toBeNull();
    expect(summary).toMatchObject({ rows: 2000, skippedRows: 1, warnings: [{ line: 1004, message: 'current_na is not a number ("n/a")' }] });
    expect(fragments.reduce((points, f) => points + f.length, 0)).toBe(1999);
  });

  it("fails one bad row in 100, naming its line, reason and the budget", async () => {
    const { error } = await readAll(oneChunk(probeText(HEADER, rowsWith(100, { 40: "1,3,zero,0,0" }))));
    expect(error?.code).toBe("bad_value");
    expect(error?.line).toBe(44);
    expect(error?.message).toBe('line 44: die_y is not an integer ("zero"); 1 bad row of 100 exceeds the error budget of 0.1 %');
  });

  it("takes the code from the first bad row and honours a tenant's larger budget", async () => {
    const rows = rowsWith(100, { 10: "0,0,0,0,0", 20: "1,1,0,x,0" });
    const { error } = await readAll(oneChunk(probeText(HEADER, rows)));
    expect(error?.code).toBe("wafer_range");
    expect(error?.message).toContain("2 bad rows of 100 exceed the error budget of 0.1 %");
    expect((await readAll(oneChunk(probeText(HEADER, rows)), { errorBudgetFraction: 0.02 })).error).toBeNull();
  });

  it("skips rows with the wrong number of fields, a non-integer die, a die beyond the integer range or a non-positive temperature", async () => {
    const rows = ["1,0,0,-1,-1,300", "1,0,0,1,1", "1,0.5,0,1,1,300", "1,0,0,2,2,-4", "1,0,-3000000000,2,2,300", "1,0,0,3,3,300", "1,0,0,4,4,"];
    const kept = await readAll(oneChunk(probeText(`${HEADER},temperature_k`, rows.slice(0, 6))), { errorBudgetFraction: 1 });
    expect(kept.summary?.warnings).toEqual([
      { line: 5, message: "expected 6 fields, found 5" },
      { line: 6, message: 'die_x is not an integer ("0.5")' },
      { line: 7, message: 'temperature_k is not a positive number ("-4")' },
      { line: 8, message: 'die_y is outside ±2147483647 ("-3000000000")' },
    ]);
    expect(kept.fragments.map((f) => [f.length, f.temperatureK])).toEqual([[2, 300]]);
  });

  it("treats an empty temperature_k as the chuck temperature, which conflicts with a row temperature in the same die", async () => {
    const { error } = await readAll(oneChunk(probeText(`${HEADER},temperature_k`, ["1,0,0,-1,-1,300", "1,0,0,1,1,"])));
    expect(error?.message).toBe("line 5: die (wafer 1, x 0, y 0) has points at the chuck temperature (temperature_k empty) here and 300 K on line 4");
    const blank = await readAll(oneChunk(probeText(`${HEADER},temperature_k`, ["1,0,0,-1,-1,", "1,0,0,1,1, "])));
    expect(blank.fragments.map((f) => f.temperatureK)).toEqual([null]);
  });

  it("keeps the first 100 warnings and counts the rest", async () => {
    const bad = Object.fromEntries(Array.from({ length: 300 }, (_, i) => [3 * i, "1,0,0,1,?"]));
    const { summary } = await readAll(oneChunk(probeText(HEADER, rowsWith(1000, bad))), { errorBudgetFraction: 0.5 });
    expect(summary?.skippedRows).toBe(300);
    expect(summary?.warnings).toHaveLength(100);
    expect(summary?.warningsOmitted).toBe(200);
  });
});

describe("readProbeFile whole-file refusals", () => {
  it("refuses a file beyond maxBytes with the limit in MB and no line", async () => {
    const { error } = await readAll(tinyChunks(fixtureBytes("good-small.csv")), { maxBytes: 1000 });
    expect({ code: error?.code, line: error?.line, message: error?.message }).toEqual({
      code: "too_large",
      line: null,
      message: "the file is larger than the 0.001 MB limit (1000 bytes)",
    });
    expect((await readAll(oneChunk(fixtureBytes("good-small.csv")), { maxBytes: 1251 })).error).toBeNull();
  });

  it("refuses files without data rows as empty", async () => {
    expect((await readAll(oneChunk(""))).error?.code).toBe("empty");
    expect((await readAll(oneChunk("\uFEFF# lot: A\n\n"))).error?.message).toBe("the file has no header line and no data rows");
    const headerOnly = await readAll(oneChunk(`# lot: A\n${HEADER}`));
    expect({ code: headerOnly.error?.code, message: headerOnly.error?.message }).toEqual({
      code: "empty",
      message: "the file has no data rows after the header on line 2",
    });
  });

  it("refuses bytes that are not UTF-8 with their line, in any chunking", async () => {
    const text = probeText(`${HEADER},site`, ["1,0,0,-1,-1,A1", "1,0,0,1,1,Zürich", "1,0,0,2,2,B#"]);
    const bytes = new TextEncoder().encode(text);
    bytes[bytes.lastIndexOf(0x23)] = 0xe9; // "B#" → "B" + Latin-1 é on line 6
    for (const source of [oneChunk(bytes), tinyChunks(bytes)]) {
      const { error } = await readAll(source);
      expect({ code: error?.code, line: error?.line }).toEqual({ code: "encoding", line: 6 });
    }
  });

  it("refuses a header with no separator", async () => {
    const { error } = await readAll(oneChunk("wafer die_x die_y\n1 0 0\n"));
    expect({ code: error?.code, line: error?.line }).toEqual({ code: "bad_header", line: 1 });
  });

  it("skips a row with broken quoting as a bad row", async () => {
    const { summary } = await readAll(oneChunk(probeText(HEADER, [...rowsWith(10), '1,0,0,4,"6"x'])), { errorBudgetFraction: 0.5 });
    expect(summary?.warnings).toEqual([{ line: 14, message: "malformed row: text after a closing quote" }]);
  });

  it("stops cleanly when the consumer leaves after the first fragment", async () => {
    const kinds: string[] = [];
    for await (const item of readProbeFile(tinyChunks(fixtureBytes("good-small.csv")))) {
      kinds.push(item.kind);
      if (item.kind === "fragment") break;
    }
    expect(kinds).toEqual(["header", "fragment"]);
  });
});
