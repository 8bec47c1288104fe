export type ProbeFileErrorCode =
  | "missing_column"
  | "unknown_unit"
  | "bad_value"
  | "wafer_range"
  | "mixed_temperature"
  | "too_large"
  | "empty"
  | "bad_header"
  | "error_budget"
  | "encoding";

/** A refusal of the whole file (§4): the code says why, `line` is the 1-based physical line or null, the message names both. */
export class ProbeFileError extends Error {
  readonly code: ProbeFileErrorCode;
  readonly line: number | null;
  /** The message without its line prefix. */
  readonly reason: string;

  constructor(code: ProbeFileErrorCode, line: number | null, reason: string) {
    super(line === null ? reason : `line ${line}: ${reason}`);
    this.name = "ProbeFileError";
    this.code = code;
    this.line = line;
    this.reason = reason;
  }
}

/** Quotes a cell for a message, shortened so a runaway field cannot flood the job report. */
export function quoteCell(value: string): string {
  const shown = value.length > 40 ? `${value.slice(0, 40)}…` : value;
  return JSON.stringify(shown);
}
