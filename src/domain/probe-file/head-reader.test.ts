import { describe, expect, it } from "vitest";
import { HeadReader, MAX_HEAD_BYTES, type ProbeFileHead } from "./head-reader";
import { ProbeFileError } from "./probe-file-error";

const encode = (text: string): Uint8Array => new TextEncoder().encode(text);
const decode = (bytes: Uint8Array): string => new TextDecoder().decode(bytes);

function readHead(text: string, chunkSize = Infinity): ProbeFileHead | null {
  const reader = new HeadReader();
  const bytes = encode(text);
  const size = Math.min(chunkSize, bytes.length);
  for (let at = 0; at < bytes.length; at += size) {
    const head = reader.push(bytes.slice(at, at + size));
    if (head !== null) return head;
  }
  return reader.finish();
}

function refusal(run: () => unknown): ProbeFileError {
  try {
    run();
  } catch (error) {
    if (error instanceof ProbeFileError) return error;
    throw error;
  }
  throw new Error("expected a ProbeFileError");
}

describe("HeadReader", () => {
  const text = "\uFEFF# Lot: TW2611-0147\r\n\r\n#product :  VD-NW40 \r\n# measured_at: 2026-11-28T06:40:00Z\r\nwafer,die_x\r\n1,0\r\n";

  it("strips the BOM, counts blank lines and CRLF lines, and stops at the header", () => {
    const head = readHead(text);
    expect(head?.headerLine).toBe(5);
    expect(head?.headerText).toBe("wafer,die_x");
    expect(head?.metadata).toEqual({ lot: "TW2611-0147", product: "VD-NW40", measured_at: "2026-11-28T06:40:00Z" });
    expect(decode(head?.rest ?? new Uint8Array(0))).toBe("1,0\r\n");
  });

  it("gives the same head when the bytes arrive one at a time (BOM and CRLF split too)", () => {
    for (const size of [1, 2, 3, 5]) {
      const head = readHead(text, size);
      expect(head?.headerLine, `chunks of ${size}`).toBe(5);
      expect(head?.metadata.lot).toBe("TW2611-0147");
    }
  });

  it("returns a header line that has no line ending at the end of the file", () => {
    const head = readHead("# lot: A\nwafer,die_x");
    expect(head?.headerLine).toBe(2);
    expect(head?.rest.length).toBe(0);
  });

  it("returns null when the file never reaches a header line", () => {
    expect(readHead("# lot: A\n\n")).toBeNull();
    expect(readHead("")).toBeNull();
  });

  it("warns about a # line that is not `key: value` and keeps going", () => {
    const head = readHead("# exported by station software\n# lot: A\nwafer\n");
    expect(head?.warnings).toEqual([{ line: 1, message: "metadata line is not `# key: value`; ignored" }]);
    expect(head?.metadata).toEqual({ lot: "A" });
  });

  it("refuses a metadata key given twice with different values, naming both lines", () => {
    const error = refusal(() => readHead("# lot: A\n# LOT: B\nwafer\n"));
    expect(error.code).toBe("bad_header");
    expect(error.line).toBe(2);
    expect(error.message).toBe('line 2: metadata "lot" is given twice with different values ("A" on line 1, "B" here)');
  });

  it("refuses CR-only line endings", () => {
    const error = refusal(() => readHead("# lot: A\rwafer,die_x\r1,0\r"));
    expect(error.code).toBe("bad_header");
    expect(error.line).toBe(1);
  });

  it("gives up with bad_header after a mebibyte without a header line", () => {
    const reader = new HeadReader();
    const line = encode(`# note: ${"x".repeat(1000)}\n`);
    const error = refusal(() => {
      for (let sent = 0; sent <= MAX_HEAD_BYTES + line.length; sent += line.length) reader.push(line);
    });
    expect(error.code).toBe("bad_header");
  });
});
