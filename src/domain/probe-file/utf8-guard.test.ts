import { describe, expect, it } from "vitest";
import { ProbeFileError } from "./probe-file-error";
import { Utf8Guard } from "./utf8-guard";

const encode = (text: string): Uint8Array => new TextEncoder().encode(text);

function refusal(run: () => void): ProbeFileError {
  try {
    run();
  } catch (error) {
    if (error instanceof ProbeFileError) return error;
    throw error;
  }
  throw new Error("expected a ProbeFileError");
}

describe("Utf8Guard", () => {
  it("accepts multi-byte characters split across one-byte chunks", () => {
    const guard = new Utf8Guard();
    for (const byte of encode("site: Zürich µ-probe 🔬\n")) guard.check(Uint8Array.of(byte));
    expect(() => guard.finish()).not.toThrow();
  });

  it("names the line of a Latin-1 byte", () => {
    const bytes = Uint8Array.from([...encode("a\nb\r\nsite "), 0xe9, ...encode("\nc\n")]);
    const guard = new Utf8Guard();
    const error = refusal(() => guard.check(bytes));
    expect(error.code).toBe("encoding");
    expect(error.line).toBe(3);
    expect(error.message).toContain("0xE9 at byte 10");
  });

  it("finds the same line when the bad byte arrives in a later chunk", () => {
    const guard = new Utf8Guard();
    guard.check(encode("one\ntwo\n"));
    guard.check(encode("thr"));
    const error = refusal(() => guard.check(Uint8Array.of(0x65, 0xff, 0x0a)));
    expect(error.line).toBe(3);
    expect(error.message).toContain("0xFF at byte 12");
  });

  it("refuses a sequence cut off by the end of the file", () => {
    const guard = new Utf8Guard();
    guard.check(Uint8Array.from([...encode("x\ny"), 0xe2, 0x82]));
    const error = refusal(() => guard.finish());
    expect(error.code).toBe("encoding");
    expect(error.line).toBe(2);
  });

  it("refuses a U+FFFD left by an earlier lossy conversion", () => {
    const guard = new Utf8Guard();
    const error = refusal(() => guard.check(encode("ok\nbad \uFFFD here\n")));
    expect(error.line).toBe(2);
  });
});
