import "server-only";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { access, AUTH_ERRORS, errors, isoDateTime, json } from "./components";
import { z } from "./zod-openapi";

// The excursion list of §6/§9; its handler is being added alongside this document.
const EXCURSION_STATUSES = ["open", "acknowledged", "resolved"] as const;

const excursionSchema = z
  .object({
    id: z.string().uuid(),
    title: z.string(),
    status: z.enum(EXCURSION_STATUSES).describe("open → acknowledged → resolved"),
    trigger: z.enum(["rule", "yield-floor", "edge-zone", "manual"]).describe("What opened it: a control-chart rule, a lot under the yield floor, a weak edge zone, or a person"),
    rule: z.string().nullable().describe("The rule that fired, e.g. WE1 or N2; null for other triggers"),
    product: z.string().describe("Product code"),
    lots: z.array(z.string()).describe("Lot numbers involved"),
    wafers: z.array(z.object({ lot: z.string(), wafer: z.number().int().min(1).max(25) })).describe("Wafers involved, when the signal is wafer-level"),
    owner: z.string().nullable().describe("Who owns it"),
    openedAt: isoDateTime,
    acknowledgedAt: isoDateTime.nullable(),
    resolvedAt: isoDateTime.nullable(),
    rootCause: z.string().nullable().describe("Required to resolve"),
    note: z.string().nullable().describe("Resolution note; required to resolve"),
  })
  .openapi("Excursion");

const excursionQuery = z.object({
  status: z.enum(EXCURSION_STATUSES).optional().describe("Only excursions in this state"),
  product: z.string().optional().describe("Product code"),
});

export function registerExcursionPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "get",
    path: "/api/v1/excursions",
    operationId: "listExcursions",
    tags: ["Excursions"],
    summary: "List excursions",
    description: "Newest first. Excursion internals are for the fab's staff: a customer caller gets 403.",
    ...access("data.read"),
    request: { query: excursionQuery },
    responses: {
      200: { description: "The excursions", content: json(z.object({ excursions: z.array(excursionSchema) }).openapi("ExcursionList")) },
      ...errors(...AUTH_ERRORS, "unprocessable"),
    },
  });
}
