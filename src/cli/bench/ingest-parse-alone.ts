// The benchmark's yardstick: csv-parse alone over the same bytes, doing nothing with the records.
import { createReadStream } from "node:fs";
import { parse } from "csv-parse";

export interface ParseRun {
  records: number;
  seconds: number;
  /** User + system CPU seconds of this process while it parsed. */
  cpuSeconds: number;
  recordsPerSecond: number;
}

/**
 * Reads the file with csv-parse (columns: false, cast: false) and only counts the data records, from
 * `firstDataLine` (1-based). Starting there matters: with the one-field metadata lines as its first records,
 * csv-parse builds (and, under relax_column_count, drops) a CsvError with a stack trace for every later row,
 * which measured here ran ~15× slower.
 */
export async function parseAlone(path: string, firstDataLine: number): Promise<ParseRun> {
  const started = process.hrtime.bigint();
  const cpu = process.cpuUsage();
  const parser = createReadStream(path).pipe(parse({ columns: false, cast: false, from_line: firstDataLine }));
  let records = 0;
  for await (const _record of parser) records++;
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  const used = process.cpuUsage(cpu);
  return { records, seconds, cpuSeconds: (used.user + used.system) / 1e6, recordsPerSecond: records / seconds };
}
