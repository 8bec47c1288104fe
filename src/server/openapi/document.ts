import "server-only";
import { OpenAPIRegistry, OpenApiGeneratorV31 } from "@asteasolutions/zod-to-openapi";
import { registerComponents, TAGS } from "./components";
import { registerCustomerPaths } from "./paths-customers";
import { registerDeviceModelPaths } from "./paths-device-models";
import { registerExcursionPaths } from "./paths-excursions";
import { registerIngestPaths } from "./paths-ingest";
import { registerLotPaths } from "./paths-lots";
import { registerProductPaths } from "./paths-products";
import { registerSessionPaths } from "./paths-session";

export type OpenApiDocument = ReturnType<OpenApiGeneratorV31["generateDocument"]>;

const DESCRIPTION = [
  "The Lotwarden public API (v1): probe stations and scripts upload lots and read results; the app's own screens use it too.",
  "Authenticate with `Authorization: Bearer <api key>` (machines) or the session cookie (browsers). JSON everywhere except CSV bodies and exports.",
  "Numbers are SI base units unless the name says otherwise: conductance in S, current in A, voltage in V, temperature in K; dieWidthMm and the like say their unit.",
  'Errors are `{"error": {"code", "message", "details"}}` with the status of the code; a request for another tenant\'s or customer\'s object answers 404, never 403.',
].join("\n\n");

/** The OpenAPI 3.1 document of the §9 API, generated from the zod schemas the handlers validate with. */
export function buildOpenApiDocument(): OpenApiDocument {
  const registry = new OpenAPIRegistry();
  registerComponents(registry);
  registerSessionPaths(registry);
  registerIngestPaths(registry);
  registerLotPaths(registry);
  registerProductPaths(registry);
  registerExcursionPaths(registry);
  registerDeviceModelPaths(registry);
  registerCustomerPaths(registry);
  const document = new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: "3.1.0",
    info: { title: "Lotwarden API", version: "1.0.0", description: DESCRIPTION },
    security: [{ apiKey: [] }, { sessionCookie: [] }],
    tags: TAGS.map((tag) => ({ ...tag })),
  });
  dropNullFromParameters(document);
  return document;
}

// The generator marks z.coerce.number() as nullable (its input is unknown); a path or query value is a string
// and never JSON null, so the "null" type is dropped from parameters.
function dropNullFromParameters(document: OpenApiDocument): void {
  for (const item of Object.values(document.paths ?? {})) {
    for (const operation of [item.get, item.post, item.put, item.patch, item.delete]) {
      for (const parameter of operation?.parameters ?? []) {
        const schema = "schema" in parameter ? parameter.schema : undefined;
        if (!schema || "$ref" in schema || !Array.isArray(schema.type)) continue;
        const types = schema.type.filter((t) => t !== "null");
        schema.type = types.length === 1 ? types[0] : types;
      }
    }
  }
}
