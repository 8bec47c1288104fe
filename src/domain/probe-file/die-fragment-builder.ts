import type { ColumnLayout } from "./header-columns";
import { ProbeFileError, quoteCell, type ProbeFileErrorCode } from "./probe-file-error";
import { type FragmentBatch, FragmentBatchWriter } from "./fragment-batch";
import { MAX_KEPT_WARNINGS, type RowWarning } from "./probe-file-types";
import { parseStrictNumber } from "./strict-number";

const FIRST_WAFER_SLOT = 1; // §3: a wafer is slot 1–25 of its lot
const LAST_WAFER_SLOT = 25;
// Die coordinates are stored as PostgreSQL integers (int4).
const COORDINATE_LIMIT = 2_147_483_647;
// Lets skipped == fraction × rows pass despite the product's last-bit rounding.
const BUDGET_ROUNDING = 1 + 1e-12;

interface BadRow {
  line: number;
  code: ProbeFileErrorCode;
  message: string;
}

function formatTemperature(temperatureK: number | null): string {
  return temperatureK === null ? "the chuck temperature (temperature_k empty)" : `${temperatureK} K`;
}

/**
 * Turns parsed rows into DieFragments (§4): a fragment closes when (wafer, die_x, die_y) changes or at the end. Bad
 * rows are skipped with a warning and judged against the error budget at the end; two temperatures inside one
 * fragment are fatal. Errors are kept in `fatal` rather than thrown, because rows arrive inside csv-parse's callback.
 */
export class DieFragmentBuilder {
  rows = 0;
  skippedRows = 0;
  fragments = 0;
  warningsOmitted = 0;
  fatal: ProbeFileError | null = null;
  private firstBad: BadRow | null = null;
  private lastSkippedLine = 0;
  private readonly batch = new FragmentBatchWriter();
  private open = false;
  private wafer = 0;
  private x = 0;
  private y = 0;
  // The cells the open fragment's last row had (a die's rows repeat them).
  private waferCell = "";
  private xCell = "";
  private yCell = "";
  private temperatureCell = "";
  private temperatureK: number | null = null;
  private site: string | null = null;
  private firstLine = 0;
  private lastLine = 0;

  constructor(
    private readonly layout: ColumnLayout,
    readonly warnings: RowWarning[],
  ) {}

  /** One csv-parse record at its 1-based physical line. */
  addRow(record: readonly string[], line: number): void {
    if (this.fatal !== null) return;
    this.rows++;
    const c = this.layout;
    if (record.length !== c.fieldCount) return this.skip(line, "bad_value", `expected ${c.fieldCount} fields, found ${record.length}`);
    const waferCell = record[c.wafer]!;
    const xCell = record[c.dieX]!;
    const yCell = record[c.dieY]!;
    // A die's rows repeat its wafer, x and y cells: the same text again is the same (already valid) number.
    const sameDie = this.open && waferCell === this.waferCell && xCell === this.xCell && yCell === this.yCell;
    let wafer = this.wafer;
    let x = this.x;
    let y = this.y;
    if (!sameDie) {
      wafer = parseStrictNumber(waferCell);
      if (Number.isNaN(wafer)) return this.skipCell(record, line, c.wafer, "is not a number");
      if (!Number.isInteger(wafer) || wafer < FIRST_WAFER_SLOT || wafer > LAST_WAFER_SLOT) {
        return this.skipCell(record, line, c.wafer, `is not an integer in ${FIRST_WAFER_SLOT}–${LAST_WAFER_SLOT}`, "wafer_range");
      }
      x = parseStrictNumber(xCell);
      if (!Number.isInteger(x)) return this.skipCell(record, line, c.dieX, "is not an integer");
      if (Math.abs(x) > COORDINATE_LIMIT) return this.skipCell(record, line, c.dieX, `is outside ±${COORDINATE_LIMIT}`);
      y = parseStrictNumber(yCell);
      if (!Number.isInteger(y)) return this.skipCell(record, line, c.dieY, "is not an integer");
      if (Math.abs(y) > COORDINATE_LIMIT) return this.skipCell(record, line, c.dieY, `is outside ±${COORDINATE_LIMIT}`);
    }
    const bias = parseStrictNumber(record[c.bias]);
    if (Number.isNaN(bias)) return this.skipCell(record, line, c.bias, "is not a number");
    const current = parseStrictNumber(record[c.current]);
    if (Number.isNaN(current)) return this.skipCell(record, line, c.current, "is not a number");
    let temperatureK: number | null = null;
    if (c.temperature >= 0) {
      const cell = record[c.temperature] ?? "";
      if (sameDie && cell === this.temperatureCell) temperatureK = this.temperatureK;
      else {
        temperatureK = parseStrictNumber(cell);
        if (Number.isNaN(temperatureK) && cell.trim() === "") temperatureK = null;
        else if (!(temperatureK > 0)) return this.skipCell(record, line, c.temperature, "is not a positive number");
      }
    }
    let hit = 0;
    if (c.compliance >= 0) {
      const cell = record[c.compliance] ?? "";
      const flag = cell === "1" ? 1 : cell === "0" || cell === "" ? 0 : parseStrictNumber(cell);
      if (flag === 1) hit = 1;
      else if (flag !== 0 && !(Number.isNaN(flag) && cell.trim() === "")) return this.skipCell(record, line, c.compliance, "is not 0 or 1");
    }
    if (!this.open || wafer !== this.wafer || x !== this.x || y !== this.y) {
      this.closeFragment();
      this.openFragment(record, wafer, x, y, temperatureK, line);
    } else if (temperatureK !== this.temperatureK) {
      const die = `die (wafer ${wafer}, x ${x}, y ${y})`;
      const earlier = `${formatTemperature(this.temperatureK)} on line ${this.firstLine}`;
      this.fatal = new ProbeFileError("mixed_temperature", line, `${die} has points at ${formatTemperature(temperatureK)} here and ${earlier}`);
      return;
    }
    this.waferCell = waferCell;
    this.xCell = xCell;
    this.yCell = yCell;
    if (c.temperature >= 0) this.temperatureCell = record[c.temperature] ?? "";
    this.batch.point(bias / c.biasDivisor, current / c.currentDivisor, hit);
    this.lastLine = line;
  }

  /** A row csv-parse itself could not split (broken quoting); several reports for one line count once. */
  addSkipped(line: number, message: string): void {
    if (this.fatal !== null || line === this.lastSkippedLine) return;
    this.rows++;
    this.skip(line, "bad_value", message);
  }

  /** Closes the last fragment at the end of the file. */
  finish(): void {
    this.closeFragment();
  }

  /** Fragments completed since the last call, in file order, as one batch. */
  takeBatch(): FragmentBatch {
    return this.batch.take();
  }

  /** Throws when skipped rows exceed `fraction` × data rows, with the first bad row's code, line and reason. */
  checkBudget(fraction: number): void {
    const first = this.firstBad;
    if (first === null || this.skippedRows <= fraction * this.rows * BUDGET_ROUNDING) return;
    const plural = this.skippedRows === 1 ? "row" : "rows";
    const verb = this.skippedRows === 1 ? "exceeds" : "exceed";
    const percent = Number((fraction * 100).toPrecision(6));
    const budget = `${this.skippedRows} bad ${plural} of ${this.rows} ${verb} the error budget of ${percent} %`;
    throw new ProbeFileError(first.code, first.line, `${first.message}; ${budget}`);
  }

  private skipCell(record: readonly string[], line: number, column: number, problem: string, code: ProbeFileErrorCode = "bad_value"): void {
    this.skip(line, code, `${this.layout.names[column] ?? `column ${column + 1}`} ${problem} (${quoteCell(record[column] ?? "")})`);
  }

  private skip(line: number, code: ProbeFileErrorCode, message: string): void {
    this.skippedRows++;
    this.lastSkippedLine = line;
    if (this.firstBad === null) this.firstBad = { line, code, message };
    if (this.warnings.length < MAX_KEPT_WARNINGS) this.warnings.push({ line, message });
    else this.warningsOmitted++;
  }

  private openFragment(record: readonly string[], wafer: number, x: number, y: number, temperatureK: number | null, line: number): void {
    this.open = true;
    this.wafer = wafer;
    this.x = x;
    this.y = y;
    this.temperatureK = temperatureK;
    const site = this.layout.site >= 0 ? (record[this.layout.site] ?? "").trim() : "";
    this.site = site === "" ? null : site;
    this.firstLine = line;
  }

  private closeFragment(): void {
    if (!this.open) return;
    this.open = false;
    this.fragments++;
    this.batch.end(this.wafer, this.x, this.y, this.temperatureK, this.site, this.firstLine, this.lastLine);
  }
}
