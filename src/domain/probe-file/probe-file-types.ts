export type BiasUnit = "v" | "mv" | "uv";
export type CurrentUnit = "a" | "ma" | "ua" | "na" | "pa";

export interface ProbeFileHeader {
  /** `# key: value` lines before the header: keys lower-cased, values trimmed, as given (lot, product, chuck_temperature_k…). */
  metadata: Record<string, string>;
  delimiter: "," | ";" | "\t";
  /** Bias and current columns as named in the file, with the unit their name carries. */
  biasColumn: string;
  biasUnit: BiasUnit;
  currentColumn: string;
  currentUnit: CurrentUnit;
  /** Columns the reader does not use, as named in the file, for the job report. */
  ignoredColumns: string[];
  /** 1-based physical line of the header in the file as uploaded. */
  headerLine: number;
}

/** One consecutive run of rows of the same die (wafer, x, y); a die split over the file yields several. */
export interface DieFragment {
  wafer: number;
  x: number;
  y: number;
  /** Views of exactly `length` points, in file order, in SI units (V, A). */
  biasV: Float64Array;
  currentA: Float64Array;
  /** 1 where the source hit its compliance limit on that point. */
  compliance: Uint8Array;
  length: number;
  /** From the temperature_k column; null when the column is absent or its cells are empty (chuck temperature applies). */
  temperatureK: number | null;
  /** The site cell of the fragment's first row, trimmed; null when the column is absent or the cell empty. */
  site: string | null;
  firstLine: number;
  lastLine: number;
}

export interface RowWarning {
  line: number;
  message: string;
}

export interface ProbeFileSummary {
  /** Data rows after the header, skipped ones included (blank lines excluded). */
  rows: number;
  skippedRows: number;
  /** The first warnings, at most MAX_KEPT_WARNINGS; `warningsOmitted` counts the rest. */
  warnings: RowWarning[];
  warningsOmitted: number;
  bytes: number;
  fragments: number;
}

export interface ReadOptions {
  /** Skipped rows allowed, as a fraction of data rows (§4 default 0.1 % = 0.001). */
  errorBudgetFraction?: number;
  maxBytes?: number;
  onProgress?: (bytesRead: number) => void;
}

export type ProbeFileItem = { kind: "header"; header: ProbeFileHeader } | { kind: "fragment"; fragment: DieFragment };

// §4: the tenant's error budget defaults to 0.1 % of rows.
export const DEFAULT_ERROR_BUDGET_FRACTION = 0.001;

// Enough to show the pattern of a bad file without holding millions of messages.
export const MAX_KEPT_WARNINGS = 100;
