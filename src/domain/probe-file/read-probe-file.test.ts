import { describe, expect, it } from "vitest";
import { fixtureBytes, oneChunk, probeText, readAll, tinyChunks, type ReadResult } from "./probe-file-test-support";

const GOOD_FIXTURES = ["good-small.csv", "crlf-bom.csv", "mixed-units.csv", "non-consecutive.csv"];

/** The fixture's data rows split independently of the reader: [line, fields] by physical line. */
function fixtureRows(name: string, delimiter = ","): [number, string[]][] {
  const lines = new TextDecoder().decode(fixtureBytes(name)).split("\n");
  return lines.flatMap((text, index): [number, string[]][] => (/^\d/.test(text) ? [[index + 1, text.replace("\r", "").split(delimiter)]] : []));
}

async function readFixture(name: string): Promise<ReadResult> {
  return readAll(oneChunk(fixtureBytes(name)));
}

describe("readProbeFile on good-small.csv", () => {
  it("reads the §4 metadata and the header on line 6", async () => {
    const { header, error } = await readFixture("good-small.csv");
    expect(error).toBeNull();
    expect(header).toEqual({
      metadata: { lot: "TW2611-0147", product: "VD-NW40", chuck_temperature_k: "300.15", station: "PRB-03", measured_at: "2026-11-28T06:40:00Z" },
      delimiter: ",",
      biasColumn: "bias_mv",
      biasUnit: "mv",
      currentColumn: "current_na",
      currentUnit: "na",
      ignoredColumns: [],
      headerLine: 6,
    });
  });

  it("emits one fragment of 11 points per die, with the physical lines of its rows", async () => {
    const { fragments, summary } = await readFixture("good-small.csv");
    expect(fragments.map((f) => [f.wafer, f.x, f.y, f.length, f.firstLine, f.lastLine])).toEqual([
      [1, 0, 0, 11, 7, 17],
      [1, 1, 0, 11, 18, 28],
      [1, 1, 1, 11, 29, 39],
      [2, 0, 0, 11, 40, 50],
      [2, 1, 0, 11, 51, 61],
      [2, 1, 1, 11, 62, 72],
    ]);
    expect(summary).toEqual({ rows: 66, skippedRows: 0, warnings: [], warningsOmitted: 0, bytes: 1251, fragments: 6 });
    expect(fragments.every((f) => f.temperatureK === null && f.site === null && f.compliance.every((hit) => hit === 0))).toBe(true);
  });

  it("converts mV to V and nA to A: each point is the file's value ÷ 1e3 or ÷ 1e9 (relative 1e-15)", async () => {
    const { fragments } = await readFixture("good-small.csv");
    const byLine = new Map(fixtureRows("good-small.csv"));
    for (const fragment of fragments) {
      for (let i = 0; i < fragment.length; i++) {
        const fields = byLine.get(fragment.firstLine + i) ?? [];
        expect(fragment.biasV[i]).toBeCloseTo(Number(fields[3]) * 1e-3, 15);
        expect(Math.abs((fragment.currentA[i] ?? 0) - Number(fields[4]) * 1e-9)).toBeLessThanOrEqual(1e-15 * Math.abs(Number(fields[4]) * 1e-9));
      }
    }
    expect(fragments[0]?.biasV[0]).toBe(-0.01);
  });

  it("recovers the invented conductances 1.2–1.7 µS from I = G·V (zero-mean biases: G = ΣVI/ΣV², within 1 nS)", async () => {
    const { fragments } = await readFixture("good-small.csv");
    const conductancesS = fragments.map((f) => {
      let sumVI = 0;
      let sumVV = 0;
      for (let i = 0; i < f.length; i++) {
        sumVI += (f.biasV[i] ?? 0) * (f.currentA[i] ?? 0);
        sumVV += (f.biasV[i] ?? 0) ** 2;
      }
      return sumVI / sumVV;
    });
    conductancesS.forEach((g, k) => expect(Math.abs(g - (1.2 + 0.1 * k) * 1e-6)).toBeLessThan(1e-9));
  });
});

describe("readProbeFile line endings, BOM, blank lines and chunking", () => {
  it("gives crlf-bom.csv the same header, fragments and line numbers as good-small.csv", async () => {
    const lf = await readFixture("good-small.csv");
    const crlf = await readFixture("crlf-bom.csv");
    expect(crlf.error).toBeNull();
    expect(crlf.header).toEqual(lf.header);
    expect(crlf.fragments).toEqual(lf.fragments);
    // 3 BOM bytes and one CR per line more.
    expect(crlf.summary).toEqual({ ...lf.summary, bytes: (lf.summary?.bytes ?? 0) + 3 + 72 });
  });

  it("counts blank lines anywhere in the physical line numbers, under CRLF and a BOM", async () => {
    const lines = ["\uFEFF", "# lot: TW2611-0147", "", "# product: VD-NW40", "wafer,die_x,die_y,bias_mv,current_na", ""];
    const text = [...lines, "1,0,0,-1,-1.5", "1,0,0,1,1.5", "", "", "1,1,0,-1,-1.4", "1,1,0,1,x", ""].join("\r\n");
    const { header, fragments, summary } = await readAll(oneChunk(text), { errorBudgetFraction: 0.5 });
    expect(header?.headerLine).toBe(5);
    expect(fragments.map((f) => [f.x, f.firstLine, f.lastLine])).toEqual([
      [0, 7, 8],
      [1, 11, 11],
    ]);
    expect(summary?.warnings).toEqual([{ line: 12, message: 'current_na is not a number ("x")' }]);
  });

  it.each(GOOD_FIXTURES)("gives identical results for %s delivered in chunks of 1–7 bytes", async (name) => {
    const whole = await readFixture(name);
    for (const seed of [1, 7, 42]) expect(await readAll(tinyChunks(fixtureBytes(name), seed))).toEqual(whole);
  });

  it("accepts string chunks as well as bytes", async () => {
    const text = new TextDecoder().decode(fixtureBytes("good-small.csv"));
    const pieces = (async function* () {
      for (let at = 0; at < text.length; at += 100) yield text.slice(at, at + 100);
    })();
    expect(await readAll(pieces)).toEqual(await readFixture("good-small.csv"));
  });

  it("reports progress in bytes read, ending at the file size", async () => {
    const seen: number[] = [];
    await readAll(tinyChunks(fixtureBytes("good-small.csv")), { onProgress: (bytesRead) => seen.push(bytesRead) });
    expect(seen.every((bytes, i) => i === 0 || bytes > (seen[i - 1] ?? 0))).toBe(true);
    expect(seen.at(-1)).toBe(1251);
  });
});

describe("readProbeFile units, columns and fragments", () => {
  it("reads mixed-units.csv: semicolons, V and µA in scientific notation, per-row temperature, an ignored column", async () => {
    const { header, fragments, error } = await readFixture("mixed-units.csv");
    expect(error).toBeNull();
    expect(header).toMatchObject({ delimiter: ";", biasColumn: "bias_v", currentColumn: "current_ua", ignoredColumns: ["smu_range"], headerLine: 4 });
    expect(fragments.map((f) => [f.x, f.length, f.temperatureK])).toEqual([
      [0, 11, 300],
      [1, 11, 350],
    ]);
    // Line 5 is "1;0;0;-1.0e-2;-1.4996e-2;300.0;1e-5": −10 mV and −1.4996e−2 µA = −1.4996e−8 A.
    expect(fragments[0]?.biasV[0]).toBe(-0.01);
    expect(fragments[0]?.currentA[0]).toBeCloseTo(-1.4996e-8, 20);
  });

  it("reads a tab-separated file", async () => {
    const { header, fragments } = await readAll(oneChunk("wafer\tdie_x\tdie_y\tbias_v\tcurrent_a\n7\t1\t2\t0.005\t7.5e-9\n"));
    expect(header?.delimiter).toBe("\t");
    expect(fragments.map((f) => [f.wafer, f.x, f.y, f.biasV[0], f.currentA[0], f.firstLine])).toEqual([[7, 1, 2, 0.005, 7.5e-9, 2]]);
  });

  it("splits non-consecutive.csv into three fragments, die (1,0,0) twice", async () => {
    const { fragments } = await readFixture("non-consecutive.csv");
    expect(fragments.map((f) => [f.wafer, f.x, f.y, f.length, f.firstLine, f.lastLine])).toEqual([
      [1, 0, 0, 5, 5, 9],
      [1, 1, 0, 11, 10, 20],
      [1, 0, 0, 6, 21, 26],
    ]);
  });

  it("reads site and compliance, and grows a fragment past its first 16 points in order", async () => {
    const rows = Array.from({ length: 40 }, (_, i) => `3,-2,5,${i - 20},${2 * (i - 20)},${i === 39 ? "1" : i % 2 === 0 ? "0" : ""}, A7 `);
    const { fragments } = await readAll(oneChunk(probeText("wafer,die_x,die_y,bias_uv,current_pa,compliance,site", rows)));
    expect(fragments).toHaveLength(1);
    const [die] = fragments;
    expect(die).toMatchObject({ wafer: 3, x: -2, y: 5, length: 40, site: "A7", firstLine: 4, lastLine: 43, temperatureK: null });
    expect(Array.from(die?.biasV ?? [])).toEqual(Array.from({ length: 40 }, (_, i) => (i - 20) / 1e6));
    expect(Array.from(die?.currentA ?? [])).toEqual(Array.from({ length: 40 }, (_, i) => (2 * (i - 20)) / 1e12));
    expect(Array.from(die?.compliance ?? []).indexOf(1)).toBe(39);
  });

  it("converts −774.2 nA to the double −7.742e−7 A (÷ 1e9, not × 1e−9, which gives −7.742000000000001e−7)", async () => {
    const { fragments } = await readAll(oneChunk(probeText("wafer,die_x,die_y,bias_mv,current_na", ["1,0,0,-10,-774.2"])));
    expect(fragments[0]?.currentA[0]).toBe(-7.742e-7);
  });
});
