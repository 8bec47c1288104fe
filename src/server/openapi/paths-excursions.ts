import "server-only";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { access, AUTH_ERRORS, errors, isoDateTime, json } from "./components";
import { z } from "./zod-openapi";

// The excursion list of §6/§9, exactly as GET /api/v1/excursions returns each item (ExcursionListItem).
const EXCURSION_STATUSES = ["open", "acknowledged", "resolved"] as const;

const excursionSchema = z
  .object({
    id: z.string().uuid(),
    number: z.number().int().positive().describe("Per-tenant number, as shown on the pages (/excursions/{number} works too)"),
    status: z.enum(EXCURSION_STATUSES).describe("open → acknowledged → resolved"),
    product: z.string().describe("Product code"),
    trigger: z.enum(["rule", "yield_floor", "edge_ring", "manual"]).describe("What opened it: a control-chart rule, a lot under the yield floor, an edge ring, or a person"),
    title: z.string(),
    lots: z.array(z.string()).describe("Lot numbers involved"),
    owner: z.string().nullable().describe("Who owns it"),
    openedAt: isoDateTime,
    updatedAt: isoDateTime,
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
