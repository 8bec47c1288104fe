import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

// Threat: an entry point that skips the auth and scope checks. Every export of a route.ts or actions.ts must be
// built by one of the wrappers, so skipping a check means not using a wrapper, and this test sees it.
const APP = path.resolve(__dirname);
const ROUTE_WRAPPERS = /^export const (GET|POST|PUT|PATCH|DELETE) = (apiRoute|publicRoute|internalRoute)\(/;
const ACTION_WRAPPERS = /^export const \w+Action = (appAction|publicAction)\(/;
const ALLOWED_ROUTE_CONFIG = /^export const (dynamic|runtime|maxDuration) = /;

function files(dir: string, name: RegExp): string[] {
  return readdirSync(dir).flatMap((entry) => {
    const full = path.join(dir, entry);
    return statSync(full).isDirectory() ? files(full, name) : name.test(entry) ? [full] : [];
  });
}

function exportLines(file: string): string[] {
  return readFileSync(file, "utf8").split("\n").filter((l) => l.startsWith("export "));
}

describe("every entry point goes through a wrapper", () => {
  it("builds each route handler export with apiRoute, publicRoute or internalRoute", () => {
    const routes = files(APP, /^route\.ts$/);
    expect(routes.length).toBeGreaterThan(2);
    for (const file of routes) {
      for (const line of exportLines(file)) {
        expect(ROUTE_WRAPPERS.test(line) || ALLOWED_ROUTE_CONFIG.test(line), `${path.relative(APP, file)}: ${line}`).toBe(true);
      }
    }
  });

  it("builds each server action (actions.ts, *-actions.ts) with appAction or publicAction", () => {
    const actions = files(APP, /(^|-)actions\.ts$/);
    expect(actions.length).toBeGreaterThan(2);
    for (const file of actions) {
      const text = readFileSync(file, "utf8");
      expect(text.startsWith('"use server";'), file).toBe(true);
      for (const line of exportLines(file)) expect(ACTION_WRAPPERS.test(line), `${path.relative(APP, file)}: ${line}`).toBe(true);
    }
  });
});
