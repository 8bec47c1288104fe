import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { appUrl, createTestTenant, ownerPool, type TestTenant } from "@/test/tenants";

// Every /api/v1 route, every caller: the expected status for each (§2, §9). A route file that is not in this
// table fails the coverage check below, so new routes cannot skip it.
type Caller = "anonymous" | "admin" | "engineer" | "analyst" | "customer" | "otherCustomer" | "otherTenantAdmin";
const CALLERS: Caller[] = ["anonymous", "admin", "engineer", "analyst", "customer", "otherCustomer", "otherTenantAdmin"];

interface Case {
  method: string;
  route: string; // the route folder under api/v1, e.g. "customers"
  path: (t: TestTenant) => string;
  body?: (t: TestTenant) => unknown;
  rawBody?: string;
  expect: Partial<Record<Caller, number>> & { default?: number };
}

const unique = () => Math.random().toString(36).slice(2, 8);

const CASES: Case[] = [
  { method: "GET", route: "customers", path: () => "/api/v1/customers", expect: { anonymous: 401, default: 200 } },
  {
    method: "POST",
    route: "customers",
    path: () => "/api/v1/customers",
    body: () => ({ name: `Matrix customer ${unique()}` }),
    expect: { anonymous: 401, admin: 201, otherTenantAdmin: 201, default: 403 },
  },
  { method: "GET", route: "products", path: () => "/api/v1/products", expect: { anonymous: 401, customer: 403, otherCustomer: 403, default: 200 } },
  { method: "POST", route: "products", path: () => "/api/v1/products", body: () => ({}), expect: { anonymous: 401, analyst: 403, customer: 403, otherCustomer: 403, default: 422 } },
  { method: "GET", route: "products/[code]", path: () => "/api/v1/products/NO-SUCH", expect: { anonymous: 401, customer: 403, otherCustomer: 403, default: 404 } },
  { method: "PATCH", route: "products/[code]", path: () => "/api/v1/products/NO-SUCH", body: () => ({ name: "x" }), expect: { anonymous: 401, analyst: 403, customer: 403, otherCustomer: 403, default: 404 } },
  { method: "GET", route: "jobs", path: () => "/api/v1/jobs", expect: { anonymous: 401, customer: 403, otherCustomer: 403, default: 200 } },
  { method: "GET", route: "jobs/[id]", path: () => `/api/v1/jobs/${crypto.randomUUID()}`, expect: { anonymous: 401, customer: 403, otherCustomer: 403, default: 404 } },
  { method: "GET", route: "lots", path: () => "/api/v1/lots", expect: { anonymous: 401, default: 200 } },
  { method: "GET", route: "lots/[lot]", path: () => "/api/v1/lots/NO-SUCH-LOT", expect: { anonymous: 401, default: 404 } },
  { method: "GET", route: "lots/[lot]/dies", path: () => "/api/v1/lots/NO-SUCH-LOT/dies", expect: { anonymous: 401, customer: 403, otherCustomer: 403, default: 404 } },
  { method: "GET", route: "lots/[lot]/report", path: () => "/api/v1/lots/NO-SUCH-LOT/report", expect: { anonymous: 401, default: 404 } },
  { method: "POST", route: "lots/ingest", path: () => "/api/v1/lots/ingest", rawBody: "not,a,probe,file\n", expect: { anonymous: 401, analyst: 403, customer: 403, otherCustomer: 403, default: 422 } },
  {
    method: "POST",
    route: "device-models/evaluate",
    path: () => "/api/v1/device-models/evaluate",
    body: () => ({ model: { kind: "step", modes: 4, transmission: 0.95, edgeEv: -0.05 }, fermiLevelEv: 0, temperaturesK: [4, 77, 300] }),
    expect: { anonymous: 401, customer: 403, otherCustomer: 403, default: 200 },
  },
  { method: "GET", route: "products/[code]/limits", path: () => "/api/v1/products/NO-SUCH/limits", expect: { anonymous: 401, customer: 403, otherCustomer: 403, default: 404 } },
  { method: "POST", route: "products/[code]/limits", path: () => "/api/v1/products/NO-SUCH/limits", body: () => ({ lots: ["NO-SUCH-LOT"] }), expect: { anonymous: 401, analyst: 403, customer: 403, otherCustomer: 403, default: 404 } },
  { method: "POST", route: "lots/[lot]/ink", path: () => "/api/v1/lots/NO-SUCH-LOT/ink", body: () => ({ wafer: 1, dies: [[0, 0]], inked: true }), expect: { anonymous: 401, analyst: 403, customer: 403, otherCustomer: 403, default: 404 } },
  { method: "POST", route: "lots/[lot]/disposition", path: () => "/api/v1/lots/NO-SUCH-LOT/disposition", body: () => ({ action: "hold", reason: "matrix check" }), expect: { anonymous: 401, analyst: 403, customer: 403, otherCustomer: 403, default: 404 } },
  { method: "GET", route: "excursions", path: () => "/api/v1/excursions", expect: { anonymous: 401, customer: 403, otherCustomer: 403, default: 200 } },
  { method: "POST", route: "session", path: () => "/api/v1/session", body: () => ({ email: `nobody-${unique()}@example.test`, password: "x" }), expect: { default: 401 } },
  { method: "DELETE", route: "session", path: () => "/api/v1/session", expect: { default: 204 } },
];

const pool = ownerPool();
let home: TestTenant;
let other: TestTenant;

beforeAll(async () => {
  home = await createTestTenant(pool, "matrix");
  other = await createTestTenant(pool, "matrix-other");
});
afterAll(() => pool.end());

function keyFor(caller: Caller): string | null {
  switch (caller) {
    case "anonymous": return null;
    case "otherCustomer": return home.keys.customer2!;
    case "otherTenantAdmin": return other.keys.admin!;
    default: return home.keys[caller]!;
  }
}

describe("route × role matrix over the real app (threat: a route that forgets its role check)", () => {
  for (const c of CASES) {
    it(`${c.method} ${c.route} answers each caller as expected`, async () => {
      const got: Record<string, number> = {};
      const want: Record<string, number> = {};
      for (const caller of CALLERS) {
        const key = keyFor(caller);
        const headers: Record<string, string> = { ...(key ? { authorization: `Bearer ${key}` } : {}) };
        const json = c.body?.(home);
        if (json !== undefined) headers["content-type"] = "application/json";
        if (c.rawBody !== undefined) headers["content-type"] = "text/csv";
        const body = c.rawBody ?? (json === undefined ? undefined : JSON.stringify(json));
        const response = await fetch(`${appUrl}${c.path(home)}`, { method: c.method, headers, body });
        got[caller] = response.status;
        want[caller] = c.expect[caller] ?? c.expect.default!;
        if (response.status >= 400) {
          const json = await response.json();
          expect(Object.keys(json.error).sort(), `${caller} error shape`).toEqual(["code", "details", "message"]);
        }
      }
      expect(got).toEqual(want);
    });
  }

  it("covers every route handler and method under /api/v1", () => {
    const root = path.resolve(__dirname);
    const found: string[] = [];
    const walk = (dir: string) => {
      for (const entry of readdirSync(dir)) {
        const full = path.join(dir, entry);
        if (statSync(full).isDirectory()) walk(full);
        else if (entry === "route.ts") {
          const route = path.relative(root, dir).split(path.sep).join("/");
          for (const m of readFileSync(full, "utf8").matchAll(/^export const (GET|POST|PUT|PATCH|DELETE) =/gm)) found.push(`${m[1]} ${route}`);
        }
      }
    };
    walk(root);
    const covered = new Set(CASES.map((c) => `${c.method} ${c.route}`));
    expect(found.filter((f) => !covered.has(f))).toEqual([]);
  });

  it("shows a customer only their own customer account (threat: one customer reading another's name)", async () => {
    const response = await fetch(`${appUrl}/api/v1/customers`, { headers: { authorization: `Bearer ${home.keys.customer}` } });
    const body = await response.json();
    expect(body.customers.map((c: { id: string }) => c.id)).toEqual([home.customers[0]!.id]);
  });

  it("refuses a revoked or mangled API key with 401 (threat: a leaked then revoked key)", async () => {
    const mangled = home.keys.admin!.slice(0, -2) + "xx";
    expect((await fetch(`${appUrl}/api/v1/customers`, { headers: { authorization: `Bearer ${mangled}` } })).status).toBe(401);
    const prefix = home.keys.engineer!.split("_")[1];
    await pool.query("update api_keys set revoked_at = now() where prefix = $1", [prefix]);
    expect((await fetch(`${appUrl}/api/v1/customers`, { headers: { authorization: `Bearer ${home.keys.engineer}` } })).status).toBe(401);
  });
});
