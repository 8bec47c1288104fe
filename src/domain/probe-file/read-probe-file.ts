import { DieFragmentBuilder } from "./die-fragment-builder";
import { type FragmentBatch, unpackFragments } from "./fragment-batch";
import { HeadReader, type ProbeFileHead } from "./head-reader";
import { detectDelimiter, resolveColumns } from "./header-columns";
import { ProbeFileError } from "./probe-file-error";
import {
  DEFAULT_ERROR_BUDGET_FRACTION,
  type ProbeFileHeader,
  type ProbeFileItem,
  type ProbeFileSummary,
  type ReadOptions,
} from "./probe-file-types";
import { RowParser } from "./row-parser";
import { Utf8Guard } from "./utf8-guard";

export type ProbeFileBatchItem = { kind: "header"; header: ProbeFileHeader } | { kind: "batch"; batch: FragmentBatch };

interface Reading {
  header: ProbeFileHeader;
  rows: DieFragmentBuilder;
  parser: RowParser;
}

function tooLarge(maxBytes: number): ProbeFileError {
  const megabytes = Number((maxBytes / 1e6).toPrecision(4));
  return new ProbeFileError("too_large", null, `the file is larger than the ${megabytes} MB limit (${maxBytes} bytes)`);
}

function startReading(head: ProbeFileHead): Reading {
  const delimiter = detectDelimiter(head.headerText);
  if (delimiter === null) {
    throw new ProbeFileError("bad_header", head.headerLine, "the header line has no comma, semicolon or tab between column names");
  }
  const { layout, header: columns } = resolveColumns(head.headerText.split(delimiter), head.headerLine);
  const header: ProbeFileHeader = { metadata: head.metadata, delimiter, ...columns, headerLine: head.headerLine };
  const rows = new DieFragmentBuilder(layout, head.warnings);
  return { header, rows, parser: new RowParser(delimiter, head.headerLine, rows) };
}

function feed(reading: Reading, bytes: Uint8Array): void {
  if (bytes.length > 0) reading.parser.write(bytes);
  if (reading.rows.fatal !== null) throw reading.rows.fatal;
}

async function endParser(parser: RowParser): Promise<void> {
  if (parser.destroyed) return;
  await new Promise<void>((resolve) => {
    parser.once("finish", resolve);
    parser.once("close", resolve);
    parser.end();
  });
}

/**
 * Streams a probe lot CSV (§4): yields the header, then one DieFragment per consecutive run of a die's rows (SI
 * units), and returns the summary. Refusals throw ProbeFileError with the 1-based physical line. Bad rows are
 * skipped with warnings and refused at the end only beyond `errorBudgetFraction` × data rows (default 0.1 %).
 * Memory stays bounded by the chunk size; `maxBytes` is checked as bytes arrive.
 */
export async function* readProbeFile(
  source: AsyncIterable<Uint8Array | string>,
  options: ReadOptions = {},
): AsyncGenerator<ProbeFileItem, ProbeFileSummary, undefined> {
  return yield* fragmentItems(readProbeFileBatches(source, options));
}

/**
 * A batch reader's items with each batch unpacked into its fragments, in order; the same summary or refusal. A
 * consumer that stops early stops the batch reader too.
 */
export async function* fragmentItems(
  reader: AsyncGenerator<ProbeFileBatchItem, ProbeFileSummary, undefined>,
): AsyncGenerator<ProbeFileItem, ProbeFileSummary, undefined> {
  try {
    for (;;) {
      const next = await reader.next();
      if (next.done) return next.value;
      if (next.value.kind === "header") yield next.value;
      else for (const fragment of unpackFragments(next.value.batch)) yield { kind: "fragment", fragment };
    }
  } finally {
    await reader.return(undefined as never);
  }
}

/**
 * readProbeFile with the fragments of each chunk of the source in one FragmentBatch: the same header, fragments,
 * summary and refusals, for a consumer that hands them on whole (to another thread) rather than one by one.
 */
export async function* readProbeFileBatches(
  source: AsyncIterable<Uint8Array | string>,
  options: ReadOptions = {},
): AsyncGenerator<ProbeFileBatchItem, ProbeFileSummary, undefined> {
  const budgetFraction = options.errorBudgetFraction ?? DEFAULT_ERROR_BUDGET_FRACTION;
  if (!(budgetFraction >= 0 && budgetFraction <= 1)) throw new RangeError(`errorBudgetFraction must be in 0–1, got ${budgetFraction}`);
  const encoder = new TextEncoder();
  const guard = new Utf8Guard();
  const headReader = new HeadReader();
  let bytes = 0;
  let reading: Reading | null = null;
  try {
    for await (const piece of source) {
      const chunk = typeof piece === "string" ? encoder.encode(piece) : piece;
      bytes += chunk.length;
      if (options.maxBytes !== undefined && bytes > options.maxBytes) throw tooLarge(options.maxBytes);
      guard.check(chunk);
      if (reading !== null) {
        feed(reading, chunk);
      } else {
        const head = headReader.push(chunk);
        if (head !== null) {
          reading = startReading(head);
          yield { kind: "header", header: reading.header };
          feed(reading, head.rest);
        }
      }
      if (reading !== null) yield { kind: "batch", batch: reading.rows.takeBatch() };
      options.onProgress?.(bytes);
    }
    guard.finish();
    if (reading === null) {
      const head = headReader.finish();
      if (head === null) throw new ProbeFileError("empty", null, "the file has no header line and no data rows");
      reading = startReading(head);
      yield { kind: "header", header: reading.header };
    }
    await endParser(reading.parser);
    const rows = reading.rows;
    if (rows.fatal !== null) throw rows.fatal;
    rows.finish();
    yield { kind: "batch", batch: rows.takeBatch() };
    rows.checkBudget(budgetFraction);
    if (rows.rows === rows.skippedRows) {
      const what = rows.rows === 0 ? "no data rows" : `no usable data rows (all ${rows.rows} were skipped)`;
      throw new ProbeFileError("empty", null, `the file has ${what} after the header on line ${reading.header.headerLine}`);
    }
    const { skippedRows, warnings, warningsOmitted, fragments } = rows;
    return { rows: rows.rows, skippedRows, warnings, warningsOmitted, bytes, fragments };
  } finally {
    reading?.parser.destroy();
  }
}
