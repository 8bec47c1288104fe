import "server-only";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { PERMISSIONS, type Permission } from "@/lib/permissions";
import { type ErrorCode, errorStatus } from "../http/errors";
import { z } from "./zod-openapi";

// The cookie name of server/auth/session.ts, repeated because importing that module opens the database pool;
// document.test.ts reads the source to keep the two equal.
export const SESSION_COOKIE_NAME = "lotwarden_session";

export const TAGS = [
  { name: "Session", description: "Sign in for a session cookie (browsers and scripts that act as a person) and sign out." },
  { name: "Ingest", description: "Upload probe lot files (§4) and follow their ingest jobs." },
  { name: "Lots", description: "Lots, their wafers and per-die linear-response results (§5), dispositions and the customer lot report." },
  { name: "Products", description: "Device types with their spec window, extraction settings and frozen control-limit versions (§6)." },
  { name: "Excursions", description: "Rule violations, yield-floor and edge-zone signals, and hand-raised excursions (§6)." },
  { name: "Device models", description: "Expected linear-response conductance from a conductance-function model (§8)." },
  { name: "Customers", description: "The tenant's customer accounts." },
  { name: "Service", description: "Liveness and this document." },
] as const;

const SECURITY_SCHEMES = {
  apiKey: {
    type: "http",
    scheme: "bearer",
    description: "`Authorization: Bearer <api key>`. Keys are made by admins under Settings → API keys, shown once, stored hashed, and act in one tenant with one role.",
  },
  sessionCookie: {
    type: "apiKey",
    in: "cookie",
    name: SESSION_COOKIE_NAME,
    description: "The browser session from POST /api/v1/session or the sign-in page. A state change that rides on the cookie must come from the app's own origin.",
  },
} as const;

const errorSchema = z
  .object({
    error: z.object({
      code: z.enum(Object.keys(errorStatus) as [ErrorCode, ...ErrorCode[]]).describe("Stable machine-readable code; branch on this, not on the message"),
      message: z.string().describe("Plain-language reason, fit to show a person"),
      details: z
        .unknown()
        .describe("null, or structured detail: for 422 a list of {path, message} per invalid field; for a refused probe file {line, code, message} with the 1-based physical line"),
    }),
  })
  .openapi("Error", { description: "The §9 error shape, for every status from 400 up." });

const ERROR_TEXT: Record<Exclude<ErrorCode, "internal" | "unavailable">, string> = {
  invalid: "400 invalid: the request cannot be read (malformed JSON, an empty body, a form without its file part)",
  unauthenticated: "401 unauthenticated: no session cookie and no valid API key, or wrong sign-in credentials",
  forbidden: "403 forbidden: the caller's role may not do this, or a cross-origin request rode on the session cookie",
  not_found: "404 not found: absent, or belongs to another tenant or customer (existence is never revealed)",
  conflict: "409 conflict: the change clashes with what exists (a duplicate name or code, a disposition the lot's status forbids)",
  too_large: "413 too large: the body is over the limit (1 MB for JSON; the configured upload limit for probe files)",
  unsupported_media_type: "415 unsupported media type: send the Content-Type the operation lists",
  unprocessable: "422 unprocessable: the input parsed but is invalid; `details` lists each problem with its field path or CSV line",
  rate_limited: "429 rate limited: too many attempts; wait for the Retry-After header's seconds",
};

type DocumentedError = keyof typeof ERROR_TEXT;

const responseName = (code: DocumentedError) => code.replace(/(^|_)(\w)/g, (_m, _s, c: string) => c.toUpperCase());

/** Registers the Error schema, one reusable response per documented error code, and the security schemes. */
export function registerComponents(registry: OpenAPIRegistry): void {
  registry.register("Error", errorSchema);
  for (const [code, description] of Object.entries(ERROR_TEXT) as [DocumentedError, string][]) {
    registry.registerComponent("responses", responseName(code), {
      description,
      content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } },
    });
  }
  for (const [name, scheme] of Object.entries(SECURITY_SCHEMES)) registry.registerComponent("securitySchemes", name, scheme);
}

/** References to the shared error responses, keyed by HTTP status. */
export function errors(...codes: DocumentedError[]): Record<string, { $ref: string }> {
  return Object.fromEntries(codes.map((code) => [String(errorStatus[code]), { $ref: `#/components/responses/${responseName(code)}` }]));
}

/** Errors every authenticated operation can answer; 403 covers both the role check and the cookie origin check. */
export const AUTH_ERRORS = ["unauthenticated", "forbidden"] as const satisfies readonly DocumentedError[];
/** Errors of reading a JSON body (server/http/body.ts) and validating it with zod. */
export const JSON_BODY_ERRORS = ["invalid", "too_large", "unsupported_media_type", "unprocessable"] as const satisfies readonly DocumentedError[];

/** The operation fields that state who may call it: the roles of a permission, from lib/permissions.ts. */
export function access(permission: Permission): { "x-permission": Permission; "x-roles": string[] } {
  return { "x-permission": permission, "x-roles": [...PERMISSIONS[permission]] };
}

export const lotParam = z.object({
  lot: z.string().describe("Lot number, URL-encoded").openapi({ example: "TW2611-0147" }),
});
export const productCodeParam = z.object({
  code: z.string().describe("Product code").openapi({ example: "VD-NW40" }),
});

export const isoDateTime = z.string().describe("ISO 8601 date-time, UTC").openapi({ format: "date-time" });
export const binCounts = z.record(z.string(), z.number().int()).describe("Die count per bin (NODATA, SHORT, OPEN, NONLINEAR, LOW, HIGH, PASS)");

/** A JSON content map for a request body or response. */
export function json(schema: z.ZodType, example?: unknown) {
  return { "application/json": example === undefined ? { schema } : { schema, example } };
}
