import { describe, expect, it } from "vitest";
import { FragmentBatchWriter, transferables, unpackFragments } from "./fragment-batch";
import type { DieFragment } from "./probe-file-types";

function fragment(i: number, length: number, site: string | null, temperatureK: number | null): DieFragment {
  const biasV = Float64Array.from({ length }, (_, k) => (k - length / 2) * 1e-3 + i);
  const currentA = Float64Array.from({ length }, (_, k) => k * 1e-9 - i);
  const compliance = Uint8Array.from({ length }, (_, k) => (k + i) % 3 === 0 ? 1 : 0);
  return { wafer: 1 + (i % 25), x: i - 40, y: -i, biasV, currentA, compliance, length, temperatureK, site, firstLine: 10 + i * 7, lastLine: 10 + i * 7 + length - 1 };
}

/** Writes a whole fragment the way the reader does, point by point. */
function add(writer: FragmentBatchWriter, f: DieFragment): void {
  for (let k = 0; k < f.length; k++) writer.point(f.biasV[k]!, f.currentA[k]!, f.compliance[k]!);
  writer.end(f.wafer, f.x, f.y, f.temperatureK, f.site, f.firstLine, f.lastLine);
}

describe("fragment batches", () => {
  it("give back every fragment as added, past several growths of their arrays", () => {
    const writer = new FragmentBatchWriter();
    const added = Array.from({ length: 700 }, (_, i) => fragment(i, 1 + (i % 40), i % 5 === 0 ? null : `S${i}`, i % 3 === 0 ? null : 77 + i));
    added.forEach((f) => add(writer, f));
    const batch = writer.take();
    expect(batch.count).toBe(700);
    expect(unpackFragments(batch)).toEqual(added);
    expect(writer.take().count).toBe(0);
    expect(transferables(batch)).toHaveLength(5);
  });

  it("carry no site list when no fragment has a site, and start empty after a take", () => {
    const writer = new FragmentBatchWriter();
    add(writer, fragment(1, 11, null, null));
    const first = writer.take();
    expect(first.sites).toBeNull();
    expect(unpackFragments(first)[0]).toMatchObject({ site: null, temperatureK: null, length: 11 });
    const empty = writer.take();
    expect(empty.count).toBe(0);
    expect(unpackFragments(empty)).toEqual([]);
  });

  it("keep coordinates beyond the int32 range exactly, so later checks see them as they were", () => {
    const writer = new FragmentBatchWriter();
    const f = { ...fragment(2, 3, null, 300), x: 3_000_000_000, y: -3_000_000_000 };
    add(writer, f);
    expect(unpackFragments(writer.take())[0]).toMatchObject({ x: 3_000_000_000, y: -3_000_000_000 });
  });

  it("carry the open fragment's points over a take, so a die split by a chunk boundary arrives whole", () => {
    const writer = new FragmentBatchWriter();
    for (let k = 0; k < 5; k++) writer.point(k * 1e-3, k * 1e-9, 0);
    writer.end(1, 0, 0, null, null, 7, 11);
    for (let k = 0; k < 3; k++) writer.point(10 + k, 20 + k, 1);
    expect(writer.openLength).toBe(3);
    const first = unpackFragments(writer.take());
    expect(first.map((f) => [f.x, f.length])).toEqual([[0, 5]]);
    for (let k = 3; k < 6000; k++) writer.point(10 + k, 20 + k, k % 2);
    writer.end(1, 1, 0, 300, "E", 12, 6011);
    const [second] = unpackFragments(writer.take());
    expect(second!.length).toBe(6000);
    expect(Array.from(second!.biasV.subarray(0, 4))).toEqual([10, 11, 12, 13]);
    expect(second!.currentA[5999]).toBe(20 + 5999);
    expect(second).toMatchObject({ wafer: 1, x: 1, y: 0, temperatureK: 300, site: "E", firstLine: 12, lastLine: 6011 });
  });
});
