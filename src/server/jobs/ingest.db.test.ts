import http from "node:http";
import { afterAll, describe, expect, it } from "vitest";
import { api, createSampleProduct, fixture, ingestAndWait, upload, waitForJob } from "@/test/ingest-helpers";
import { appUrl, createTestTenant, ownerPool } from "@/test/tenants";

const pool = ownerPool();
afterAll(() => pool.end());

async function freshTenant(label: string) {
  const tenant = await createTestTenant(pool, label);
  await createSampleProduct(tenant);
  return tenant;
}

async function lotCount(tenantId: string): Promise<number> {
  const { rows } = await pool.query("select count(*)::int as n from lots where tenant_id = $1", [tenantId]);
  return rows[0].n;
}

describe("probe lot ingest through the API and the worker (§4, §5, §9)", () => {
  it("turns the sample file into a lot with per-die conductance, and the same bytes again answer the first job", async () => {
    const tenant = await freshTenant("ingest-good");
    const first = await upload(tenant, fixture("good-small.csv"));
    expect(first.status).toBe(202);
    const { job } = await first.json();
    const done = await waitForJob(tenant, job.id);
    expect(done.status).toBe("done");
    expect(done.report).toMatchObject({ rows: 66, dies: 6, wafers: [1, 2] });

    const again = await upload(tenant, fixture("good-small.csv"));
    expect(again.status).toBe(200);
    expect((await again.json()).job.id).toBe(job.id);

    const lot = await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147")).json();
    expect(lot).toMatchObject({ lot: "TW2611-0147", product: "VD-NW40", status: "probed", chuckTemperatureK: 300.15, tested: 6 });
    expect(lot.attributes).toEqual({ station: "PRB-03", measured_at: "2026-11-28T06:40:00Z" });
    expect(lot.wafers.map((w: { wafer: number; tested: number }) => [w.wafer, w.tested])).toEqual([[1, 3], [2, 3]]);

    const { dies } = await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies")).json();
    expect(dies).toHaveLength(6);
    // The sample's dies are I = G·V with G = 1.2 … 1.7 µS (fixtures/probe/README.md), swept inside the window.
    const g = dies.map((d: { conductanceS: number }) => d.conductanceS).sort();
    g.forEach((value: number, i: number) => expect(value).toBeCloseTo((1.2 + 0.1 * i) * 1e-6, 9));
    const die = dies[0];
    for (const field of ["wafer", "x", "y", "conductanceS", "offsetA", "r2", "pointsInWindow", "windowV", "nonlinearity", "modes", "bin", "outOfWindow", "temperatureK"]) expect(die).toHaveProperty(field);
    expect(die.windowV).toBeCloseTo(0.5 * 0.025865, 5); // w·kT/q at 300.15 K
    expect(die.modes).toBeCloseTo(die.conductanceS / 7.748091729863649e-5, 12);
    // specHighS 1.65 µS: the 1.7 µS die is HIGH, the rest PASS.
    expect(dies.filter((d: { bin: string }) => d.bin === "HIGH")).toHaveLength(1);
  });

  it("exports the dies as CSV with the §9 names as columns, and filters by wafer and bin", async () => {
    const tenant = await freshTenant("ingest-csv");
    await ingestAndWait(tenant, fixture("good-small.csv"));
    const csv = await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies?format=csv&wafer=2")).text();
    const [header, ...rows] = csv.trim().split("\n");
    expect(header!.split(",").slice(0, 13)).toEqual(["wafer", "x", "y", "conductanceS", "offsetA", "r2", "pointsInWindow", "windowV", "nonlinearity", "modes", "bin", "outOfWindow", "temperatureK"]);
    expect(rows).toHaveLength(3);
    const pass = await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies?bin=HIGH")).json();
    expect(pass.dies.every((d: { bin: string }) => d.bin === "HIGH")).toBe(true);
  });

  it("returns only the asked-for die fields (wafer, x, y always), as JSON and CSV, and names an unknown field", async () => {
    const tenant = await freshTenant("ingest-fields");
    await ingestAndWait(tenant, fixture("good-small.csv"));
    const full = await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies")).json();
    const slim = await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies?fields=conductanceS,bin")).json();
    expect(slim.count).toBe(6);
    // the §9 order, whatever order they were asked in
    for (const d of slim.dies) expect(Object.keys(d)).toEqual(["wafer", "x", "y", "conductanceS", "bin"]);
    expect(slim.dies).toEqual(full.dies.map((d: Record<string, unknown>) => ({ wafer: d.wafer, x: d.x, y: d.y, conductanceS: d.conductanceS, bin: d.bin })));
    const csv = await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies?format=csv&fields=outOfWindow")).text();
    expect(csv.split("\n")[0]).toBe("wafer,x,y,outOfWindow");
    const bad = await api(tenant, "analyst", "/api/v1/lots/TW2611-0147/dies?fields=bin,voltage");
    expect(bad.status).toBe(422);
    expect(JSON.stringify((await bad.json()).error)).toContain("fields");
  });

  it("reads CRLF with BOM, semicolons with scientific notation, and a die split over the file", async () => {
    const tenant = await freshTenant("ingest-variants");
    expect((await ingestAndWait(tenant, fixture("crlf-bom.csv"))).report?.dies).toBe(6);
    const other = await freshTenant("ingest-variants-2");
    const mixed = await ingestAndWait(other, fixture("mixed-units.csv"));
    expect(mixed.status).toBe("done");
    expect(mixed.report?.ignoredColumns).toEqual(["smu_range"]);
    const third = await freshTenant("ingest-variants-3");
    const split = await ingestAndWait(third, fixture("non-consecutive.csv"));
    expect(split.report?.dies).toBe(2);
    const { dies } = await (await api(third, "analyst", "/api/v1/lots/TW2611-0147/dies?x=0&y=0&include=sweep")).json();
    expect(dies[0].points).toBe(dies[0].sweep.biasV.length);
    expect(dies[0].points).toBeGreaterThan(5);
  });

  it("merges thousands of dies split over the file into the same results as the file with each die in one run", async () => {
    // 3,000 dies of 8 points, every die's sweep in two halves: first halves of all dies, then second halves. Three
    // more far from the centre: (0, 50000) and (1, −50000) once shared a merge key built from x and y.
    const header = "# lot: SPLIT-1\n# product: VD-NW40\n# chuck_temperature_k: 300\nwafer,die_x,die_y,bias_mv,current_na\n";
    const dies = Array.from({ length: 3000 }, (_, i) => ({ x: i % 60, y: Math.floor(i / 60), g: 1.2e-6 + (i % 17) * 1e-8 }))
      .concat([{ x: 0, y: 50_000, g: 1.3e-6 }, { x: 1, y: -50_000, g: 1.5e-6 }, { x: -70_000, y: 123_456, g: 1.4e-6 }]);
    const biases = [-10, -7, -4, -1, 2, 5, 8, 11];
    const row = (d: { x: number; y: number; g: number }, mv: number) => `1,${d.x},${d.y},${mv},${(d.g * mv * 1e-3 * 1e9).toFixed(6)}\n`;
    const half = (part: number[]) => dies.map((d) => part.map((mv) => row(d, mv)).join("")).join("");
    const split = header + half(biases.slice(0, 4)) + half(biases.slice(4));
    const whole = header.replace("SPLIT-1", "SPLIT-2") + half(biases);
    const tenant = await freshTenant("ingest-split-many");
    const a = await ingestAndWait(tenant, split);
    const b = await ingestAndWait(tenant, whole);
    expect(a.status).toBe("done");
    expect(a.report?.dies).toBe(3003);
    expect(b.report?.dies).toBe(3003);
    expect(Object.values(a.report?.bins ?? {}).reduce((n, k) => n + k, 0)).toBe(3003); // the merged dies, once each
    const merged = (await (await api(tenant, "analyst", "/api/v1/lots/SPLIT-1/dies")).json()).dies;
    const single = (await (await api(tenant, "analyst", "/api/v1/lots/SPLIT-2/dies")).json()).dies;
    expect(merged).toHaveLength(3003);
    expect(merged.map((d: { x: number; y: number }) => [d.x, d.y])).toEqual(single.map((d: { x: number; y: number }) => [d.x, d.y]));
    for (let i = 0; i < merged.length; i++) {
      expect(merged[i].points).toBe(8);
      expect(merged[i].conductanceS).toBeCloseTo(single[i].conductanceS, 15);
      expect(merged[i].bin).toBe(single[i].bin);
    }
  });

  it("replaces only the wafers a second file of the lot carries, and flags exactly the PASS dies outside each wafer's window", async () => {
    // Each file is several of the tests' 256 KiB COPY segments, so its wafers arrive (and are replaced) segment by
    // segment. Every wafer's dies lie in a narrow band of G but for one PASS die at 1.6 µS, which the wafer's
    // PAT window must flag.
    const biases = [-10, -7, -4, -1, 2, 5, 8, 11];
    const file = (wafers: { slot: number; dies: number; g: number }[]) =>
      "# lot: REPL-1\n# product: VD-NW40\n# chuck_temperature_k: 300\nwafer,die_x,die_y,bias_mv,current_na\n" +
      wafers.map(({ slot, dies, g }) => Array.from({ length: dies }, (_, i) => {
        const gi = i === 7 ? 1.6e-6 : g * (1 + ((i % 13) - 6) * 1e-4);
        return biases.map((mv) => `${slot},${i % 50},${Math.floor(i / 50)},${mv},${(gi * mv * 1e-3 * 1e9).toFixed(6)}\n`).join("");
      }).join("")).join("");
    const tenant = await freshTenant("ingest-replace");
    const first = await ingestAndWait(tenant, file([{ slot: 1, dies: 1500, g: 1.3e-6 }, { slot: 2, dies: 1500, g: 1.3e-6 }]));
    const second = await ingestAndWait(tenant, file([{ slot: 2, dies: 1200, g: 1.4e-6 }, { slot: 3, dies: 1100, g: 1.2e-6 }]));
    expect([first.status, second.status]).toEqual(["done", "done"]);
    expect(second.report?.wafers).toEqual([2, 3]);

    const lot = await (await api(tenant, "analyst", "/api/v1/lots/REPL-1")).json();
    expect(lot.wafers.map((w: { wafer: number; tested: number }) => [w.wafer, w.tested])).toEqual([[1, 1500], [2, 1200], [3, 1100]]);
    expect(lot.tested).toBe(3800);
    const { dies } = await (await api(tenant, "analyst", "/api/v1/lots/REPL-1/dies")).json();
    expect(dies).toHaveLength(3800);
    // The second job's report counts the bins of its own dies, those of wafers 2 and 3.
    const secondBins: Record<string, number> = {};
    for (const d of dies as { wafer: number; bin: string }[]) if (d.wafer !== 1) secondBins[d.bin] = (secondBins[d.bin] ?? 0) + 1;
    expect(second.report?.bins).toEqual(secondBins);
    for (const w of lot.wafers as { wafer: number; medianConductanceS: number; outOfWindow: number; windowLowS: number; windowHighS: number }[]) {
      const own = dies.filter((d: { wafer: number }) => d.wafer === w.wafer);
      expect(w.medianConductanceS).toBeCloseTo({ 1: 1.3e-6, 2: 1.4e-6, 3: 1.2e-6 }[w.wafer]!, 9); // wafer 2 is the second file's
      const outside = own.filter((d: { bin: string; conductanceS: number }) => d.bin === "PASS" && (d.conductanceS < w.windowLowS || d.conductanceS > w.windowHighS));
      expect(outside.map((d: { x: number; y: number }) => [d.x, d.y])).toEqual([[7, 0]]);
      expect(own.filter((d: { outOfWindow: boolean }) => d.outOfWindow)).toEqual(outside);
      expect(w.outOfWindow).toBe(1);
    }
    expect(lot.outOfWindow).toBe(3);
  });

  for (const [file, code, line] of [["non-numeric.csv", "bad_value", 9], ["wafer-out-of-range.csv", "wafer_range", 16], ["two-temperatures.csv", "mixed_temperature", 11]] as const) {
    it(`fails ${file} naming line ${line}, and writes nothing`, async () => {
      const tenant = await freshTenant(`ingest-${code}`);
      const job = await ingestAndWait(tenant, fixture(file));
      expect(job.status).toBe("failed");
      expect(job.error).toMatchObject({ code, line });
      expect(job.error!.message).toContain(`line ${line}`);
      expect(await lotCount(tenant.id)).toBe(0);
    });
  }

  for (const [file, line] of [["missing-column.csv", 3], ["unknown-unit.csv", 4]] as const) {
    it(`refuses ${file} at upload with 422 naming line ${line}, and queues nothing`, async () => {
      const tenant = await freshTenant("ingest-header");
      const response = await upload(tenant, fixture(file), "?chuck_temperature_k=300.15");
      expect(response.status).toBe(422);
      const body = await response.json();
      expect(body.error.message).toContain(`line ${line}`);
      const jobs = await (await api(tenant, "analyst", "/api/v1/jobs")).json();
      expect(jobs.jobs).toEqual([]);
    });
  }

  it("refuses a file whose product disagrees with the upload, naming both", async () => {
    const tenant = await freshTenant("ingest-mismatch");
    const response = await upload(tenant, fixture("good-small.csv"), "?product=AA-TF220");
    expect(response.status).toBe(422);
    expect((await response.json()).error.message).toMatch(/line 2: the file says product "VD-NW40" but the upload says "AA-TF220"/);
  });

  it("refuses a product of another tenant as unknown (threat: writing into someone else's product)", async () => {
    const owner = await freshTenant("ingest-owner");
    const intruder = await createTestTenant(pool, "ingest-intruder");
    expect(owner.id).not.toBe(intruder.id);
    const response = await upload(intruder, fixture("good-small.csv"));
    expect(response.status).toBe(422);
    expect((await response.json()).error.message).toContain('unknown product "VD-NW40"');
  });

  it("keeps a failed re-ingest from touching the lot's earlier wafers", async () => {
    const tenant = await freshTenant("ingest-atomic");
    await ingestAndWait(tenant, fixture("good-small.csv"));
    const bad = await ingestAndWait(tenant, fixture("two-temperatures.csv"));
    expect(bad.status).toBe("failed");
    const lot = await (await api(tenant, "analyst", "/api/v1/lots/TW2611-0147")).json();
    expect(lot.tested).toBe(6);
  });

  it("marks a die at 77 K swept in 5 mV steps NODATA: too few points inside the thermal window", async () => {
    const tenant = await freshTenant("ingest-77k");
    const rows = ["# lot: COLD-0001", "# product: VD-NW40", "# chuck_temperature_k: 77", "wafer,die_x,die_y,bias_mv,current_na"];
    for (let v = -50; v <= 50; v += 5) rows.push(`1,0,0,${v},${(v * 1.5).toFixed(3)}`);
    const job = await ingestAndWait(tenant, rows.join("\n") + "\n");
    expect(job.status).toBe("done");
    const { dies } = await (await api(tenant, "analyst", "/api/v1/lots/COLD-0001/dies")).json();
    expect(dies[0].bin).toBe("NODATA");
    expect(dies[0].reason).toMatch(/within ±3\.32 mV \(need 3\)/);
  });

  it("lets only engineers and admins upload (analyst 403, customer 403)", async () => {
    const tenant = await freshTenant("ingest-roles");
    expect((await upload(tenant, fixture("good-small.csv"), "", "analyst")).status).toBe(403);
    expect((await upload(tenant, fixture("good-small.csv"), "", "customer")).status).toBe(403);
  });

  it("stores and reads every byte of an upload larger than 10 MB, sent as the body (one PUT) or as a form part (in parts) (threat: a body silently cut by a proxy buffer)", async () => {
    const rows = ["# lot: BIG-0001", "# product: VD-NW40", "# chuck_temperature_k: 300.15", "wafer,die_x,die_y,bias_mv,current_na"];
    for (let die = 0; rows.length < 600_000; die++) {
      for (let v = -10; v <= 10; v += 2) rows.push(`${1 + (die % 25)},${Math.floor(die / 25) % 250},${Math.floor(die / 6250)},${v},${(v * 1.5).toFixed(6)}`);
    }
    const body = rows.join("\n") + "\n";
    expect(Buffer.byteLength(body)).toBeGreaterThan(11 * 1024 * 1024); // more than one 8 MiB part
    const asBody = await freshTenant("ingest-big");
    const asForm = await freshTenant("ingest-big-form");
    const form = new FormData();
    form.append("file", new Blob([body], { type: "text/csv" }), "big.csv");
    const responses = [await upload(asBody, body), await api(asForm, "engineer", "/api/v1/lots/ingest", { method: "POST", body: form })];
    for (const [tenant, response] of [[asBody, responses[0]!], [asForm, responses[1]!]] as const) {
      expect(response.status).toBe(202);
      const job = await waitForJob(tenant, (await response.json()).job.id, 170_000);
      expect(job.status).toBe("done");
      expect(job.report?.rows).toBe(rows.length - 4);
      const stored = await pool.query("select size_bytes from raw_files where tenant_id = $1", [tenant.id]);
      expect(Number(stored.rows[0].size_bytes)).toBe(Buffer.byteLength(body));
    }
  }, 180_000);

  it("refuses a body whose declared length is over the upload limit with 413 before reading it, and stores nothing", async () => {
    const tenant = await freshTenant("ingest-declared-too-large");
    const answer = await new Promise<{ status: number; text: string }>((resolve, reject) => {
      const request = http.request(new URL("/api/v1/lots/ingest", appUrl), {
        method: "POST",
        headers: { authorization: `Bearer ${tenant.keys.engineer}`, "content-type": "text/csv", "content-length": String(4 * 1024 ** 3 + 1) },
      });
      request.on("response", (response) => {
        let text = "";
        response.on("data", (c: Buffer) => (text += c.toString("utf8")));
        response.on("end", () => {
          resolve({ status: response.statusCode ?? 0, text });
          request.destroy();
        });
      });
      request.on("error", reject);
      request.write(fixture("good-small.csv")); // a few hundred bytes of the 4 GiB it announced
    });
    expect(answer.status).toBe(413);
    expect(JSON.parse(answer.text).error.message).toMatch(/larger than the limit/);
    expect((await pool.query("select count(*)::int as n from raw_files where tenant_id = $1", [tenant.id])).rows[0].n).toBe(0);
    expect(await lotCount(tenant.id)).toBe(0);
  });
});
