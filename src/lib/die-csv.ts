import { DIE_CSV_COLUMNS, type DieField, type DieRecord } from "./schemas/lots";

/** wafer, x and y, then the asked-for fields, in the §9 order; every field without `fields`. */
export function dieColumns(fields?: readonly DieField[]): readonly DieField[] {
  return fields === undefined ? DIE_CSV_COLUMNS : DIE_CSV_COLUMNS.filter((c) => c === "wafer" || c === "x" || c === "y" || fields.includes(c));
}

/** One CSV cell (RFC 4180): empty for null, quoted when it holds a comma, a quote or a line break. */
function cell(value: unknown): string {
  if (value === null || value === undefined) return "";
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * Dies as CSV with the §9 field names as the header row and SI values as the API gives them (conductanceS in S,
 * windowV in V…), one line per die, "\n" line ends: the same bytes from the API's format=csv and the die table's
 * export of its filtered rows.
 */
export function dieCsv(dies: readonly Partial<DieRecord>[], columns: readonly DieField[] = DIE_CSV_COLUMNS): string {
  return [columns.join(","), ...dies.map((d) => columns.map((c) => cell(d[c])).join(","))].join("\n") + "\n";
}
