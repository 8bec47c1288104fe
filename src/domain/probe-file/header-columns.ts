import { ProbeFileError } from "./probe-file-error";
import type { BiasUnit, CurrentUnit, ProbeFileHeader } from "./probe-file-types";

// SI prefixes, exact by definition. Dividing rounds once (−774.2 nA ÷ 1e9 = −7.742e−7 A), where × 1e−9 would also
// round the inexact 1e−9 (giving −7.742000000000001e−7).
const BIAS_DIVISORS: Record<BiasUnit, number> = { v: 1, mv: 1e3, uv: 1e6 };
const CURRENT_DIVISORS: Record<CurrentUnit, number> = { a: 1, ma: 1e3, ua: 1e6, na: 1e9, pa: 1e12 };
const BIAS_NAMES = "bias_v, bias_mv or bias_uv";
const CURRENT_NAMES = "current_a, current_ma, current_ua, current_na or current_pa";
const PLAIN_COLUMNS = ["wafer", "die_x", "die_y", "site", "compliance"];
// A short letter suffix reads as a unit (bias_kv, current_fa, temperature_c); longer ones (current_limit_a) are other columns.
const UNIT_SUFFIX = /^[a-zµμ]{1,3}$/;

/** Where each used column sits in a row (−1 when an optional column is absent) and how to bring values to SI. */
export interface ColumnLayout {
  fieldCount: number;
  names: string[];
  wafer: number;
  dieX: number;
  dieY: number;
  bias: number;
  current: number;
  temperature: number;
  site: number;
  compliance: number;
  biasDivisor: number;
  currentDivisor: number;
}

export type ResolvedHeader = Pick<ProbeFileHeader, "biasColumn" | "biasUnit" | "currentColumn" | "currentUnit" | "ignoredColumns">;

/** Picks the header's separator (§4: comma, semicolon or tab) by count, comma first on a tie; null when none occurs. */
export function detectDelimiter(headerText: string): ProbeFileHeader["delimiter"] | null {
  let best: ProbeFileHeader["delimiter"] | null = null;
  let bestCount = 0;
  for (const candidate of [",", ";", "\t"] as const) {
    const count = headerText.split(candidate).length - 1;
    if (count > bestCount) [best, bestCount] = [candidate, count];
  }
  return best;
}

function unquote(field: string): string {
  const name = field.trim();
  const quoted = name.length >= 2 && name.startsWith('"') && name.endsWith('"');
  return quoted ? name.slice(1, -1).replace(/""/g, '"').trim() : name;
}

function isBiasUnit(unit: string): unit is BiasUnit {
  return Object.hasOwn(BIAS_DIVISORS, unit);
}

function isCurrentUnit(unit: string): unit is CurrentUnit {
  return Object.hasOwn(CURRENT_DIVISORS, unit);
}

/** Splits `bias_mv` into kind and unit; µ and μ read as u. Plain `bias`/`current` have an empty unit. */
function unitColumn(key: string): { kind: "bias" | "current" | "temperature"; unit: string } | null {
  if (key === "bias" || key === "current") return { kind: key, unit: "" };
  for (const kind of ["bias", "current", "temperature"] as const) {
    if (!key.startsWith(`${kind}_`)) continue;
    const unit = key.slice(kind.length + 1).replace(/[µμ]/g, "u");
    if (UNIT_SUFFIX.test(unit)) return { kind, unit };
  }
  return null;
}

function unknownUnit(name: string, unit: string, expected: string, headerLine: number): ProbeFileError {
  const problem = unit === "" ? "has no unit" : `has an unknown unit "${unit}"`;
  return new ProbeFileError("unknown_unit", headerLine, `column "${name}" ${problem}; expected ${expected}`);
}

/**
 * Maps header fields to a ColumnLayout (§4): wafer, die_x, die_y, exactly one bias and one current column with the
 * unit in the name, optional temperature_k, site, compliance; names trimmed, case-insensitive. Throws ProbeFileError
 * missing_column, unknown_unit or bad_header (duplicates) naming the column and the header line.
 */
export function resolveColumns(fields: readonly string[], headerLine: number): { layout: ColumnLayout; header: ResolvedHeader } {
  const names = fields.map(unquote);
  const positions = new Map<string, number>();
  const ignoredColumns: string[] = [];
  let biasUnit: BiasUnit | null = null;
  let currentUnit: CurrentUnit | null = null;
  const claim = (key: string, at: number): void => {
    const earlier = positions.get(key);
    if (earlier !== undefined) {
      const twoUnits = key === "bias" || key === "current";
      const what = twoUnits
        ? `two ${key} columns ("${names[earlier]}" and "${names[at]}"); keep exactly one`
        : `column "${names[at]}" appears twice (columns ${earlier + 1} and ${at + 1})`;
      throw new ProbeFileError("bad_header", headerLine, what);
    }
    positions.set(key, at);
  };
  for (const [at, name] of names.entries()) {
    const key = name.toLowerCase();
    const unitCol = unitColumn(key);
    if (unitCol === null) {
      if (PLAIN_COLUMNS.includes(key)) claim(key, at);
      else ignoredColumns.push(name === "" ? `(unnamed column ${at + 1})` : name);
    } else if (unitCol.kind === "bias") {
      if (!isBiasUnit(unitCol.unit)) throw unknownUnit(name, unitCol.unit, BIAS_NAMES, headerLine);
      claim("bias", at);
      biasUnit = unitCol.unit;
    } else if (unitCol.kind === "current") {
      if (!isCurrentUnit(unitCol.unit)) throw unknownUnit(name, unitCol.unit, CURRENT_NAMES, headerLine);
      claim("current", at);
      currentUnit = unitCol.unit;
    } else {
      if (unitCol.unit !== "k") throw unknownUnit(name, unitCol.unit, "temperature_k (kelvin)", headerLine);
      claim("temperature_k", at);
    }
  }
  const required = (key: string, label: string): number => {
    const at = positions.get(key);
    if (at === undefined) throw new ProbeFileError("missing_column", headerLine, `the header has no ${label} column`);
    return at;
  };
  const layout: ColumnLayout = {
    fieldCount: names.length,
    names,
    wafer: required("wafer", "wafer"),
    dieX: required("die_x", "die_x"),
    dieY: required("die_y", "die_y"),
    bias: required("bias", `bias (${BIAS_NAMES})`),
    current: required("current", `current (${CURRENT_NAMES})`),
    temperature: positions.get("temperature_k") ?? -1,
    site: positions.get("site") ?? -1,
    compliance: positions.get("compliance") ?? -1,
    biasDivisor: BIAS_DIVISORS[biasUnit ?? "v"],
    currentDivisor: CURRENT_DIVISORS[currentUnit ?? "a"],
  };
  return {
    layout,
    header: {
      biasColumn: names[layout.bias] ?? "",
      biasUnit: biasUnit ?? "v",
      currentColumn: names[layout.current] ?? "",
      currentUnit: currentUnit ?? "a",
      ignoredColumns,
    },
  };
}
