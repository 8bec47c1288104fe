import { pipeline } from "node:stream/promises";
import { Readable } from "node:stream";
import { from as copyFrom } from "pg-copy-streams";
import { afterAll, describe, expect, it } from "vitest";
import type { DieResult } from "@/domain/transport";
import { ownerPool } from "@/test/tenants";
import { COPY_HEADER, COPY_TMP_DIES, COPY_TRAILER, CREATE_TMP_DIES, DieCopyEncoder } from "./die-copy";
import { decodeSweep, encodeSweep } from "./sweep-codec";

const pool = ownerPool();
afterAll(() => pool.end());

const result = (overrides: Partial<DieResult> = {}): DieResult => ({
  conductanceS: 1.2345678901234567e-5, offsetA: -3e-12, r2: 0.999999, pointsInWindow: 7, windowV: 0.012925, nonlinearity: 0.0042,
  nonlinearityWindowOnly: false, modes: 0.159, bin: "PASS", reason: null, temperatureK: 300.15, ...overrides,
});

describe("COPY binary encoding of dies (PostgreSQL binary COPY format)", () => {
  it("round-trips every column exactly through PostgreSQL: float8 bit for bit, NULLs, non-finite as NULL, UTF-8 text, the sweep", async () => {
    const sweep = { biasV: Float64Array.of(-0.01, 0, 0.01), currentA: Float64Array.of(-1.1e-7, 1e-15, 1.1e-7), compliance: Uint8Array.of(0, 0, 1), length: 3 };
    const none = { biasV: new Float64Array(0), currentA: new Float64Array(0), compliance: new Uint8Array(0), length: 0 };
    const encoder = new DieCopyEncoder();
    encoder.die(3, -12, 40, result(), "S-µ1 «north»", sweep, 57);
    encoder.die(25, 0, 0, result({ conductanceS: null, offsetA: Number.NaN, r2: Number.POSITIVE_INFINITY, nonlinearity: null, modes: null, nonlinearityWindowOnly: true, bin: "NODATA", reason: "only 2 points within ±V_w = 12.9 mV\tof 0 V" }), null, none, 1_000_000);
    const client = await pool.connect();
    try {
      await client.query("begin");
      await client.query(CREATE_TMP_DIES);
      await pipeline(Readable.from([COPY_HEADER, encoder.take(), COPY_TRAILER]), client.query(copyFrom(COPY_TMP_DIES)));
      const { rows } = await client.query("select * from tmp_dies order by wafer_slot");
      expect(rows).toHaveLength(2);
      expect(rows[0]).toMatchObject({ wafer_slot: 3, x: -12, y: 40, conductance_s: 1.2345678901234567e-5, offset_a: -3e-12, r2: 0.999999, points_in_window: 7, window_v: 0.012925, nonlinearity: 0.0042, nonlinearity_window_only: false, modes: 0.159, bin: "PASS", reason: null, temperature_k: 300.15, site: "S-µ1 «north»", points: 3, first_line: 57 });
      // The bytes are exactly the sweep codec's, as the wafer map reads them back.
      expect(Buffer.compare(rows[0].sweep, encodeSweep(sweep.biasV, sweep.currentA, sweep.compliance, 3))).toBe(0);
      expect([...decodeSweep(rows[0].sweep).currentA]).toEqual([-1.1e-7, 1e-15, 1.1e-7]);
      expect([...decodeSweep(rows[0].sweep).compliance]).toEqual([0, 0, 1]);
      expect(rows[1]).toMatchObject({ conductance_s: null, offset_a: null, r2: null, nonlinearity: null, modes: null, nonlinearity_window_only: true, bin: "NODATA", reason: "only 2 points within ±V_w = 12.9 mV\tof 0 V", site: null, first_line: 1_000_000 });
      expect(rows[1].sweep).toHaveLength(0);
    } finally {
      await client.query("rollback");
      client.release();
    }
  });

  it("grows its buffer for a die with a long sweep", () => {
    const n = 20_000;
    const encoder = new DieCopyEncoder();
    encoder.die(1, 0, 0, result(), null, { biasV: new Float64Array(n), currentA: new Float64Array(n), compliance: new Uint8Array(n), length: n }, 1);
    expect(encoder.size).toBeGreaterThan(24 * n);
  });
});
