import { readFileSync } from "node:fs";
import { ProbeFileError } from "./probe-file-error";
import type { DieFragment, ProbeFileHeader, ProbeFileItem, ProbeFileSummary, ReadOptions } from "./probe-file-types";
import { readProbeFile } from "./read-probe-file";

/** Test support: the bytes of a fixture in fixtures/probe/. */
export function fixtureBytes(name: string): Uint8Array {
  return new Uint8Array(readFileSync(new URL(`../../../fixtures/probe/${name}`, import.meta.url)));
}

/** Test support: the bytes in pieces of 1–7 bytes, sizes from a fixed pseudo-random sequence (a small LCG). */
export async function* tinyChunks(bytes: Uint8Array, seed = 7): AsyncGenerator<Uint8Array> {
  let state = seed;
  for (let at = 0; at < bytes.length; ) {
    state = (state * 1103515245 + 12345) % 2147483648;
    const size = 1 + (state % 7);
    yield bytes.slice(at, at + size);
    at += size;
  }
}

/** Test support: the source as one chunk. */
export async function* oneChunk(content: Uint8Array | string): AsyncGenerator<Uint8Array | string> {
  yield content;
}

export interface ReadResult {
  header: ProbeFileHeader | null;
  fragments: DieFragment[];
  summary: ProbeFileSummary | null;
  error: ProbeFileError | null;
}

/** Test support: drains readProbeFile (or `read`, a reader with its interface), keeping a ProbeFileError as a value so results can be compared whole. */
export async function readAll<S extends AsyncIterable<Uint8Array | string>>(
  source: S,
  options?: ReadOptions,
  read: (source: S, options?: ReadOptions) => AsyncGenerator<ProbeFileItem, ProbeFileSummary, undefined> = readProbeFile,
): Promise<ReadResult> {
  const result: ReadResult = { header: null, fragments: [], summary: null, error: null };
  try {
    const reader = read(source, options);
    for (let next = await reader.next(); ; next = await reader.next()) {
      if (next.done === true) {
        result.summary = next.value;
        break;
      }
      if (next.value.kind === "header") result.header = next.value.header;
      else result.fragments.push(next.value.fragment);
    }
  } catch (error) {
    if (!(error instanceof ProbeFileError)) throw error;
    result.error = error;
  }
  return result;
}

/** Test support: a file with the §4 metadata, the given header and rows, LF line endings. */
export function probeText(header: string, rows: readonly string[]): string {
  return ["# lot: TW2611-0147", "# product: VD-NW40", header, ...rows].join("\n") + "\n";
}
