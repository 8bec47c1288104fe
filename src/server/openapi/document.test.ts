import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { DIE_CSV_COLUMNS } from "@/lib/schemas/lots";
import { errorStatus } from "../http/errors";
import { buildOpenApiDocument } from "./document";

const document = buildOpenApiDocument();
const API = path.resolve(__dirname, "../../app/api");
const METHODS = ["get", "post", "put", "patch", "delete"] as const;

interface RouteExport {
  method: string;
  path: string;
  wrapper: string;
  permission: string | null;
}

/** Every exported handler under src/app/api except the worker's internal routes, read as text: `[lot]` → `{lot}`. */
function routeExports(dir = API): RouteExport[] {
  return readdirSync(dir).flatMap((entry): RouteExport[] => {
    const full = path.join(dir, entry);
    if (statSync(full).isDirectory()) return entry === "internal" ? [] : routeExports(full);
    if (entry !== "route.ts") return [];
    const urlPath = "/api/" + path.relative(API, dir).split(path.sep).map((s) => s.replace(/^\[(\w+)\]$/, "{$1}")).join("/");
    const text = readFileSync(full, "utf8");
    return [...text.matchAll(/^export const (GET|POST|PUT|PATCH|DELETE) = (\w+)\((\{ permission: "([\w.]+)" \})?/gm)].map((m) => ({
      method: m[1]!.toLowerCase(),
      path: urlPath,
      wrapper: m[2]!,
      permission: m[4] ?? null,
    }));
  });
}

function operations() {
  return Object.entries(document.paths ?? {}).flatMap(([p, item]) =>
    METHODS.flatMap((method) => (item[method] ? [{ key: `${method.toUpperCase()} ${p}`, path: p, op: item[method]! }] : [])),
  );
}

function refs(value: unknown): string[] {
  if (Array.isArray(value)) return value.flatMap(refs);
  if (typeof value !== "object" || value === null) return [];
  return Object.entries(value).flatMap(([k, v]) => (k === "$ref" && typeof v === "string" ? [v] : refs(v)));
}

describe("the OpenAPI document", () => {
  it("has the OpenAPI 3.x top level: version, info and paths", () => {
    expect(document.openapi).toMatch(/^3\.\d+\.\d+$/);
    expect(document.info.title).toBe("Lotwarden API");
    expect(document.info.version).toMatch(/^\d+\.\d+\.\d+$/);
    expect(Object.keys(document.paths ?? {}).length).toBeGreaterThan(10);
  });

  it("resolves every $ref to a component that exists", () => {
    const all = refs(document);
    expect(all.length).toBeGreaterThan(20);
    for (const ref of all) {
      const [, , kind, name] = ref.split("/");
      expect((document.components as Record<string, Record<string, unknown>>)[kind!]?.[name!], ref).toBeDefined();
    }
  });

  it("declares each {param} of a path as a required path parameter, and no other", () => {
    for (const { key, path: p, op } of operations()) {
      const inPath = [...p.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
      const declared = (op.parameters ?? []).flatMap((x) => ("in" in x && x.in === "path" ? [x] : []));
      expect(declared.map((x) => x.name).sort(), key).toEqual(inPath.sort());
      for (const x of declared) expect(x.required, `${key} ${x.name}`).toBe(true);
    }
  });

  it("gives every operation a unique operationId and a declared tag", () => {
    const tags = new Set((document.tags ?? []).map((t) => t.name));
    const ids = operations().map(({ op }) => op.operationId);
    expect(new Set(ids).size).toBe(ids.length);
    for (const { key, op } of operations()) expect(tags.has(op.tags?.[0] ?? ""), key).toBe(true);
  });

  it("documents every route handler under src/app/api with each method it exports", () => {
    const exported = routeExports();
    expect(exported.filter((r) => r.path.startsWith("/api/v1/")).length).toBeGreaterThanOrEqual(14);
    const documented = new Set(operations().map((o) => o.key));
    for (const route of exported) expect(documented, `${route.method.toUpperCase()} ${route.path}`).toContain(`${route.method.toUpperCase()} ${route.path}`);
  });

  it("documents the §9 routes that are specified ahead of their handlers", () => {
    const documented = new Set(operations().map((o) => o.key));
    for (const key of [
      "POST /api/v1/products/{code}/limits",
      "GET /api/v1/products/{code}/limits",
      "GET /api/v1/excursions",
      "POST /api/v1/lots/{lot}/disposition",
      "GET /api/v1/lots/{lot}/report",
      "POST /api/v1/device-models/evaluate",
    ]) expect(documented).toContain(key);
  });

  it("states the permission each apiRoute handler checks, and marks publicRoute handlers as needing no auth", () => {
    const byKey = new Map(operations().map((o) => [o.key, o.op as (typeof o.op) & { "x-permission"?: string }]));
    for (const route of routeExports()) {
      const op = byKey.get(`${route.method.toUpperCase()} ${route.path}`)!;
      if (route.wrapper === "apiRoute") {
        expect(op["x-permission"], route.path).toBe(route.permission);
        expect(op.security, route.path).toBeUndefined();
      } else {
        expect(route.wrapper).toBe("publicRoute");
        expect(op.security, route.path).toEqual([]);
      }
    }
  });

  it("gives every operation a success response, and 401 and 403 to every one that needs auth", () => {
    for (const { key, op } of operations()) {
      const statuses = Object.keys(op.responses ?? {});
      expect(statuses.some((s) => /^2\d\d$/.test(s)), key).toBe(true);
      if (op.security === undefined) expect(statuses, key).toEqual(expect.arrayContaining(["401", "403"]));
    }
    expect(Object.keys(document.paths?.["/api/v1/session"]?.post?.responses ?? {})).toEqual(expect.arrayContaining(["401", "429"]));
  });

  it("describes the §9 error statuses with the {error: {code, message, details}} shape", () => {
    const responses = document.components?.responses ?? {};
    const statuses = new Set<number>();
    for (const [name, response] of Object.entries(responses)) {
      expect(refs(response), name).toEqual(["#/components/schemas/Error"]);
      statuses.add(errorStatus[name.replace(/[A-Z]/g, (c, i: number) => (i ? "_" : "") + c.toLowerCase()) as keyof typeof errorStatus]);
    }
    expect([...statuses].sort()).toEqual([400, 401, 403, 404, 409, 413, 415, 422, 429]);
    const error = JSON.parse(JSON.stringify(document.components?.schemas?.Error));
    expect(error.required).toEqual(["error"]);
    expect(Object.keys(error.properties.error.properties)).toEqual(["code", "message", "details"]);
    expect(error.properties.error.properties.code.enum).toEqual(Object.keys(errorStatus));
  });

  it("offers the Bearer API key and the session cookie that server/auth/session.ts sets", () => {
    const source = readFileSync(path.resolve(__dirname, "../auth/session.ts"), "utf8");
    const cookie = /export const SESSION_COOKIE = "([^"]+)"/.exec(source)?.[1];
    const schemes = JSON.parse(JSON.stringify(document.components?.securitySchemes));
    expect(schemes.sessionCookie).toMatchObject({ type: "apiKey", in: "cookie", name: cookie });
    expect(schemes.apiKey).toMatchObject({ type: "http", scheme: "bearer" });
    expect(document.security).toEqual([{ apiKey: [] }, { sessionCookie: [] }]);
  });
});

describe("the die schema", () => {
  // PRODUCT.md §9: "A die in JSON carries …"
  const SPEC_FIELDS = ["wafer", "x", "y", "conductanceS", "offsetA", "r2", "pointsInWindow", "windowV", "nonlinearity", "modes", "bin", "outOfWindow", "temperatureK"];
  const die = JSON.parse(JSON.stringify(document.components?.schemas?.Die));

  it("carries exactly the §9 die fields plus the extra columns and the optional sweep the code returns", () => {
    expect(DIE_CSV_COLUMNS).toEqual(expect.arrayContaining(SPEC_FIELDS));
    expect(new Set(Object.keys(die.properties))).toEqual(new Set([...SPEC_FIELDS, ...DIE_CSV_COLUMNS, "sweep"]));
  });

  it("requires every field but the sweep", () => {
    expect(new Set(die.required)).toEqual(new Set(DIE_CSV_COLUMNS));
  });
});

describe("units in descriptions", () => {
  // Names carry their unit (§9, STYLE.md "Naming"); dieWindowK is the window's k factor, not kelvin.
  const UNITS: [RegExp, string][] = [[/[a-z]S$/, "S"], [/[a-z]A$/, "A"], [/[a-z]V$/, "V"], [/[a-z]Ks?$/, "K"], [/[a-z]Mm$/, "mm"], [/[a-z]Ev$/, "eV"]];
  const NOT_UNITS = new Set(["dieWindowK"]);

  function numericProperties(value: unknown, found: [string, { description?: string }][] = []): [string, { description?: string }][] {
    if (Array.isArray(value)) value.forEach((v) => numericProperties(v, found));
    else if (typeof value === "object" && value !== null) {
      const properties = (value as { properties?: Record<string, { type?: unknown; items?: { type?: unknown }; description?: string }> }).properties;
      for (const [name, p] of Object.entries(properties ?? {})) {
        const types = [p.type, p.items?.type].flat();
        if (types.includes("number") || types.includes("integer")) found.push([name, p]);
      }
      Object.values(value).forEach((v) => numericProperties(v, found));
    }
    return found;
  }

  it("states the unit of every number whose name ends in one", () => {
    const checked = numericProperties(document).filter(([name]) => !NOT_UNITS.has(name) && UNITS.some(([re]) => re.test(name)));
    expect(checked.length).toBeGreaterThan(30);
    for (const [name, p] of checked) {
      const unit = UNITS.find(([re]) => re.test(name))![1];
      expect(p.description ?? "", name).toMatch(new RegExp(`\\bin ${unit}\\b`));
    }
  });
});
