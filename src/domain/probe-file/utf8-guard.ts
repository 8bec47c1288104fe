import { ProbeFileError } from "./probe-file-error";

const LF = 10;
const REPLACEMENT_CHARACTER = "\uFFFD";

function countLineFeeds(bytes: Uint8Array, end: number): number {
  let count = 0;
  for (let at = bytes.indexOf(LF); at !== -1 && at < end; at = bytes.indexOf(LF, at + 1)) count++;
  return count;
}

/** Bytes at the end of `bytes` that start a UTF-8 sequence not yet complete (0–3). */
function incompleteTailLength(bytes: Uint8Array): number {
  for (let back = 1; back <= Math.min(3, bytes.length); back++) {
    const byte = bytes[bytes.length - back] ?? 0;
    if ((byte & 0xc0) === 0x80) continue;
    if (byte < 0xc0) return 0;
    return sequenceLength(byte) > back ? back : 0;
  }
  return 0;
}

function sequenceLength(lead: number): number {
  return lead >= 0xf0 ? 4 : lead >= 0xe0 ? 3 : 2;
}

/** When the byte at `at` cut short a sequence begun just before it, the lead byte of that sequence; else `at`. */
function startOfBrokenSequence(bytes: Uint8Array, at: number): number {
  if (((bytes[at] ?? 0) & 0xc0) === 0x80) return at;
  let lead = at - 1;
  while (lead >= 0 && ((bytes[lead] ?? 0) & 0xc0) === 0x80) lead--;
  const leadByte = bytes[lead] ?? 0;
  return lead >= 0 && leadByte >= 0xc0 && sequenceLength(leadByte) > at - lead ? lead : at;
}

function concat(a: Uint8Array, b: Uint8Array): Uint8Array {
  const joined = new Uint8Array(a.length + b.length);
  joined.set(a, 0);
  joined.set(b, a.length);
  return joined;
}

function decodesCleanly(bytes: Uint8Array): boolean {
  try {
    return !new TextDecoder("utf-8", { fatal: true }).decode(bytes, { stream: true }).includes(REPLACEMENT_CHARACTER);
  } catch {
    return false;
  }
}

/**
 * Checks a byte stream chunk by chunk as strict UTF-8 (§4), counting physical lines so that a refusal names the
 * line of the first bad byte. A U+FFFD already in the text counts as bad too: it marks an earlier lossy conversion.
 */
export class Utf8Guard {
  private readonly decoder = new TextDecoder("utf-8", { fatal: true });
  private tail: Uint8Array = new Uint8Array(0);
  private lineFeeds = 0;
  private offset = 0;

  /** Throws ProbeFileError encoding at the first invalid byte or U+FFFD; a sequence split across chunks is fine. */
  check(chunk: Uint8Array): void {
    let clean: boolean;
    try {
      clean = !this.decoder.decode(chunk, { stream: true }).includes(REPLACEMENT_CHARACTER);
    } catch {
      clean = false;
    }
    if (!clean) this.fail(chunk);
    const window = chunk.length >= 3 ? chunk : concat(this.tail, chunk);
    this.tail = window.slice(window.length - incompleteTailLength(window));
    this.lineFeeds += countLineFeeds(chunk, chunk.length);
    this.offset += chunk.length;
  }

  /** Call at the end of the stream: a multi-byte sequence cut off by the end of the file is an encoding error. */
  finish(): void {
    try {
      this.decoder.decode();
    } catch {
      this.refuse(this.lineFeeds + 1, this.offset - this.tail.length, this.tail[0] ?? 0, "a truncated UTF-8 sequence");
    }
  }

  private fail(chunk: Uint8Array): never {
    // Smallest prefix that no longer decodes: its last byte is the first bad one (binary search, only on failure).
    let good = 0;
    let bad = chunk.length;
    while (bad - good > 1) {
      const middle = (good + bad) >>> 1;
      if (decodesCleanly(concat(this.tail, chunk.subarray(0, middle)))) good = middle;
      else bad = middle;
    }
    const at = startOfBrokenSequence(chunk, bad - 1);
    this.refuse(this.lineFeeds + countLineFeeds(chunk, at) + 1, this.offset + at, chunk[at] ?? 0, "a byte that is not valid UTF-8");
  }

  private refuse(line: number, offset: number, byte: number, what: string): never {
    const hex = byte.toString(16).toUpperCase().padStart(2, "0");
    const reason = `the file is not UTF-8: ${what} (0x${hex} at byte ${offset}); save it as UTF-8 and upload again`;
    throw new ProbeFileError("encoding", line, reason);
  }
}
