/** Counts distinct values up to a small cap without allocating: enough to test "at least k distinct biases". */
export class DistinctCounter {
  private readonly seen: Float64Array;
  private cap = 0;
  count = 0;

  constructor(maxCap: number) {
    this.seen = new Float64Array(maxCap);
  }

  reset(cap: number): void {
    this.cap = Math.min(cap, this.seen.length);
    this.count = 0;
  }

  add(value: number): void {
    if (this.count >= this.cap) return;
    for (let i = 0; i < this.count; i++) if (this.seen[i] === value) return;
    this.seen[this.count++] = value;
  }
}
