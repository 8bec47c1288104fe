import { ProbeFileError } from "./probe-file-error";
import type { RowWarning } from "./probe-file-types";

const LF = 10;
const CR = 13;
const BOM = "\uFEFF";
// A head (metadata and header) of more than a mebibyte is not a probe file; stop before buffering a whole upload.
export const MAX_HEAD_BYTES = 1 << 20;

export interface ProbeFileHead {
  metadata: Record<string, string>;
  /** The header line's text without its line ending. */
  headerText: string;
  headerLine: number;
  /** Bytes after the header line's line ending: the start of the data rows. */
  rest: Uint8Array;
  warnings: RowWarning[];
}

/**
 * Reads the head of a probe file (§4) from byte chunks: a UTF-8 BOM, blank lines, `# key: value` metadata
 * (keys case-insensitive), then the header line; LF or CRLF. Lines are 1-based physical lines.
 */
export class HeadReader {
  private buffer = new Uint8Array(0);
  private length = 0;
  private discarded = 0;
  private scanned = 0;
  private lineStart = 0;
  private line = 1;
  private readonly decoder = new TextDecoder("utf-8", { ignoreBOM: true });
  private readonly metadata: Record<string, string> = {};
  private readonly metadataLines = new Map<string, number>();
  private readonly warnings: RowWarning[] = [];

  /** Adds a chunk; returns the head once the header line is complete, else null. */
  push(chunk: Uint8Array): ProbeFileHead | null {
    this.append(chunk);
    const filled = this.buffer.subarray(0, this.length);
    for (let at = filled.indexOf(LF, this.scanned); at !== -1; at = filled.indexOf(LF, at + 1)) {
      const head = this.takeLine(this.lineStart, at, at + 1);
      if (head !== null) return head;
      this.lineStart = at + 1;
      this.line++;
    }
    this.scanned = this.length;
    if (this.discarded + this.length > MAX_HEAD_BYTES) {
      throw new ProbeFileError("bad_header", this.line, "no header line within the first MiB of the file");
    }
    return null;
  }

  /** At the end of the stream: a header line without a line ending, or null when the file never reached one. */
  finish(): ProbeFileHead | null {
    if (this.lineStart >= this.length) return null;
    return this.takeLine(this.lineStart, this.length, this.length);
  }

  /** Appends to a buffer grown by doubling; consumed lines are dropped first so only the open line is kept. */
  private append(chunk: Uint8Array): void {
    if (this.lineStart > 0) {
      this.buffer.copyWithin(0, this.lineStart, this.length);
      this.discarded += this.lineStart;
      this.length -= this.lineStart;
      this.scanned -= this.lineStart;
      this.lineStart = 0;
    }
    if (this.length + chunk.length > this.buffer.length) {
      const grown = new Uint8Array(Math.max(2 * this.buffer.length, this.length + chunk.length, 256));
      grown.set(this.buffer.subarray(0, this.length), 0);
      this.buffer = grown;
    }
    this.buffer.set(chunk, this.length);
    this.length += chunk.length;
  }

  private takeLine(start: number, lineEnd: number, next: number): ProbeFileHead | null {
    const end = lineEnd > start && this.buffer[lineEnd - 1] === CR ? lineEnd - 1 : lineEnd;
    let text = this.decoder.decode(this.buffer.subarray(start, end));
    if (this.line === 1 && text.startsWith(BOM)) text = text.slice(1);
    if (text.includes("\r")) {
      throw new ProbeFileError("bad_header", this.line, "a bare carriage return ends a line; use LF or CRLF line endings");
    }
    const trimmed = text.trim();
    if (trimmed === "") return null;
    if (trimmed.startsWith("#")) {
      this.readMetadata(trimmed.slice(1));
      return null;
    }
    return {
      metadata: this.metadata,
      headerText: text,
      headerLine: this.line,
      rest: this.buffer.subarray(next, this.length),
      warnings: this.warnings,
    };
  }

  private readMetadata(body: string): void {
    const colon = body.indexOf(":");
    const key = colon === -1 ? "" : body.slice(0, colon).trim().toLowerCase();
    if (key === "") {
      this.warnings.push({ line: this.line, message: "metadata line is not `# key: value`; ignored" });
      return;
    }
    const value = body.slice(colon + 1).trim();
    const earlier = this.metadataLines.get(key);
    if (earlier !== undefined && this.metadata[key] !== value) {
      const values = `${JSON.stringify(this.metadata[key])} on line ${earlier}, ${JSON.stringify(value)} here`;
      throw new ProbeFileError("bad_header", this.line, `metadata "${key}" is given twice with different values (${values})`);
    }
    if (earlier === undefined) this.metadataLines.set(key, this.line);
    this.metadata[key] = value;
  }
}
