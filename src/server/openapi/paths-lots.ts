import "server-only";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { access, AUTH_ERRORS, errors, json, JSON_BODY_ERRORS, lotParam } from "./components";
import { dispositionBody, dispositionResultSchema, inkBody, lotReportSchema, reportQuery } from "./schemas-dispositions";
import { z } from "./zod-openapi";
import { dieCsvSchema, dieFiltersQuery, dieListSchema, lotDetailSchema, lotFiltersQuery, lotListSchema } from "./schemas-lots";

export function registerLotPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "get",
    path: "/api/v1/lots",
    operationId: "listLots",
    tags: ["Lots"],
    summary: "List lots",
    description: "Lots in the caller's reach, newest probed first by default, one page at a time. A customer sees only released lots of their own products.",
    ...access("reports.read"),
    request: { query: lotFiltersQuery },
    responses: { 200: { description: "One page of lots", content: json(lotListSchema) }, ...errors(...AUTH_ERRORS, "unprocessable") },
  });

  registry.registerPath({
    method: "get",
    path: "/api/v1/lots/{lot}",
    operationId: "getLot",
    tags: ["Lots"],
    summary: "Get a lot summary",
    description: "Status, product, chuck temperature (K), the file's other metadata, each wafer's tested, pass, yield and median G (S), bin counts and open excursions.",
    ...access("reports.read"),
    request: { params: lotParam },
    responses: { 200: { description: "The lot", content: json(lotDetailSchema) }, ...errors(...AUTH_ERRORS, "not_found") },
  });

  registry.registerPath({
    method: "get",
    path: "/api/v1/lots/{lot}/dies",
    operationId: "listDies",
    tags: ["Lots"],
    summary: "List a lot's dies",
    description: "Every §5 field per die, ordered by wafer, row and column; with `fields`, wafer, x, y and the named fields only. Numbers are SI base units: conductanceS in S, offsetA in A, windowV in V, temperatureK in K.",
    ...access("data.read"),
    request: { params: lotParam, query: dieFiltersQuery },
    responses: {
      200: { description: "The dies, as JSON or as a CSV download (format=csv)", content: { ...json(dieListSchema), "text/csv": { schema: dieCsvSchema } } },
      ...errors(...AUTH_ERRORS, "not_found", "unprocessable"),
    },
  });

  registry.registerPath({
    method: "post",
    path: "/api/v1/lots/{lot}/disposition",
    operationId: "setDisposition",
    tags: ["Lots"],
    summary: "Hold, release or scrap a lot",
    description: "Engineers only; the reason is required and audited. Releasing e-mails the customer's users a link to the lot report.",
    ...access("lots.disposition"),
    request: { params: lotParam, body: { required: true, content: json(dispositionBody, { action: "release", reason: "Yield and die windows within the agreement" }) } },
    responses: {
      200: { description: "The disposition was applied", content: json(dispositionResultSchema) },
      ...errors(...AUTH_ERRORS, "not_found", "conflict", ...JSON_BODY_ERRORS),
    },
  });

  registry.registerPath({
    method: "post",
    path: "/api/v1/lots/{lot}/ink",
    operationId: "inkDies",
    tags: ["Lots"],
    summary: "Ink or un-ink dies of one wafer",
    description: "Inked dies count as fails in the shipped yield; refused (409) on a released or scrapped lot. Engineers only; audited.",
    ...access("dies.ink"),
    request: { params: lotParam, body: { required: true, content: json(inkBody) } },
    responses: {
      200: { description: "How many dies changed and how many of the wafer are now inked", content: json(z.object({ wafer: z.number().int(), changed: z.number().int(), inked: z.number().int() })) },
      ...errors(...AUTH_ERRORS, "not_found", "conflict", ...JSON_BODY_ERRORS),
    },
  });

  registry.registerPath({
    method: "get",
    path: "/api/v1/lots/{lot}/report",
    operationId: "getLotReport",
    tags: ["Lots"],
    summary: "Get the customer lot report",
    description: "The report a customer receives: yield and shipped yield, bins per wafer and the spec window (S). A customer reaches only their own released lots.",
    ...access("reports.read"),
    request: { params: lotParam, query: reportQuery },
    responses: {
      200: {
        description: "The report, as JSON or as a PDF (format=pdf)",
        content: { ...json(lotReportSchema), "application/pdf": { schema: { type: "string", contentMediaType: "application/pdf" } } },
      },
      ...errors(...AUTH_ERRORS, "not_found", "unprocessable"),
    },
  });
}
