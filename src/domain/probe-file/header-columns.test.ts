import { describe, expect, it } from "vitest";
import { detectDelimiter, resolveColumns } from "./header-columns";
import { ProbeFileError } from "./probe-file-error";

function refusal(fields: string[]): ProbeFileError {
  try {
    resolveColumns(fields, 6);
  } catch (error) {
    if (error instanceof ProbeFileError) return error;
    throw error;
  }
  throw new Error("expected a ProbeFileError");
}

describe("detectDelimiter", () => {
  it("finds comma, semicolon and tab, and none in a single name", () => {
    expect(detectDelimiter("wafer,die_x,die_y")).toBe(",");
    expect(detectDelimiter("wafer;die_x;die_y")).toBe(";");
    expect(detectDelimiter("wafer\tdie_x\tdie_y")).toBe("\t");
    expect(detectDelimiter("wafer die_x die_y")).toBeNull();
  });
});

describe("resolveColumns", () => {
  it("matches names trimmed and case-insensitively, quoted or not, and lists the others", () => {
    const fields = [" Wafer", '"DIE_X"', "die_y ", "Bias_mV", "current_nA", "operator", "compliance", "Site", "current_limit_a"];
    const { layout, header } = resolveColumns(fields, 6);
    expect(layout).toMatchObject({ wafer: 0, dieX: 1, dieY: 2, bias: 3, current: 4, compliance: 6, site: 7, temperature: -1, fieldCount: 9 });
    expect(layout.biasDivisor).toBe(1e3);
    expect(layout.currentDivisor).toBe(1e9);
    expect(header).toEqual({
      biasColumn: "Bias_mV",
      biasUnit: "mv",
      currentColumn: "current_nA",
      currentUnit: "na",
      ignoredColumns: ["operator", "current_limit_a"],
    });
  });

  it("knows every §4 unit and the SI factor of each", () => {
    const divisors = { a: 1, ma: 1e3, ua: 1e6, na: 1e9, pa: 1e12 };
    for (const [unit, divisor] of Object.entries(divisors)) {
      expect(resolveColumns(["wafer", "die_x", "die_y", "bias_v", `current_${unit}`], 1).layout.currentDivisor).toBe(divisor);
    }
    expect(resolveColumns(["wafer", "die_x", "die_y", "bias_uv", "current_a"], 1).layout.biasDivisor).toBe(1e6);
    expect(resolveColumns(["wafer", "die_x", "die_y", "bias_µV", "current_μA"], 1).header).toMatchObject({ biasUnit: "uv", currentUnit: "ua" });
  });

  it("refuses an unknown unit, naming the column and the header line", () => {
    const error = refusal(["wafer", "die_x", "die_y", "bias_mv", "current_fa"]);
    expect(error.code).toBe("unknown_unit");
    expect(error.line).toBe(6);
    expect(error.message).toBe('line 6: column "current_fa" has an unknown unit "fa"; expected current_a, current_ma, current_ua, current_na or current_pa');
    expect(refusal(["wafer", "die_x", "die_y", "bias", "current_na"]).message).toBe('line 6: column "bias" has no unit; expected bias_v, bias_mv or bias_uv');
    expect(refusal(["wafer", "die_x", "die_y", "bias_mv", "current_na", "temperature_c"]).code).toBe("unknown_unit");
  });

  it("refuses a missing column by name", () => {
    const error = refusal(["wafer", "die_y", "bias_mv", "current_na"]);
    expect(error.code).toBe("missing_column");
    expect(error.message).toBe("line 6: the header has no die_x column");
    expect(refusal(["wafer", "die_x", "die_y", "bias_mv"]).message).toBe(
      "line 6: the header has no current (current_a, current_ma, current_ua, current_na or current_pa) column",
    );
  });

  it("refuses two bias columns and a repeated column", () => {
    const twoBias = refusal(["wafer", "die_x", "die_y", "bias_v", "bias_mv", "current_na"]);
    expect(twoBias.code).toBe("bad_header");
    expect(twoBias.message).toBe('line 6: two bias columns ("bias_v" and "bias_mv"); keep exactly one');
    expect(refusal(["wafer", "die_x", "die_y", "bias_v", "current_na", "WAFER"]).message).toBe('line 6: column "WAFER" appears twice (columns 1 and 6)');
  });
});
