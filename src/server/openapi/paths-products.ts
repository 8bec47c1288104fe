import "server-only";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { access, AUTH_ERRORS, errors, json, JSON_BODY_ERRORS, productCodeParam } from "./components";
import { createProductBody, limitBaselineBody, limitSetListSchema, limitSetSchema, patchProductBody, productListSchema, productSchema } from "./schemas-products";

// An invented example: 4 ballistic modes (4·G₀ ≈ 309.9 µS) with a ±5 % spec window.
const PRODUCT_EXAMPLE = {
  code: "VD-NW40",
  name: "Nanowire conductance array",
  dieWidthMm: 2.5,
  dieHeightMm: 2.5,
  waferDiameterMm: 200,
  edgeExclusionMm: 3,
  specLowS: 2.944e-4,
  specHighS: 3.254e-4,
  displayUnit: "G0",
  deviceModel: { kind: "step", modes: 4, transmission: 1, edgeEv: -0.05 },
};

export function registerProductPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "get",
    path: "/api/v1/products",
    operationId: "listProducts",
    tags: ["Products"],
    summary: "List products",
    ...access("data.read"),
    responses: { 200: { description: "The tenant's products", content: json(productListSchema) }, ...errors(...AUTH_ERRORS) },
  });

  registry.registerPath({
    method: "post",
    path: "/api/v1/products",
    operationId: "createProduct",
    tags: ["Products"],
    summary: "Create a product",
    description: "Conductances in S, lengths in mm. Omitted settings take the defaults: w = 0.5, η_max = 0.02, Western Electric rules, static die window with k = 3.",
    ...access("products.edit"),
    request: { body: { required: true, content: json(createProductBody, PRODUCT_EXAMPLE) } },
    responses: {
      201: { description: "Created", content: json(productSchema) },
      ...errors(...AUTH_ERRORS, "conflict", ...JSON_BODY_ERRORS),
    },
  });

  registry.registerPath({
    method: "get",
    path: "/api/v1/products/{code}",
    operationId: "getProduct",
    tags: ["Products"],
    summary: "Get a product",
    ...access("data.read"),
    request: { params: productCodeParam },
    responses: { 200: { description: "The product", content: json(productSchema) }, ...errors(...AUTH_ERRORS, "not_found") },
  });

  registry.registerPath({
    method: "patch",
    path: "/api/v1/products/{code}",
    operationId: "updateProduct",
    tags: ["Products"],
    summary: "Change a product's settings",
    description: "Only the fields sent change. Lots already probed keep their bins; the new settings apply to the next ingest.",
    ...access("products.edit"),
    request: { params: productCodeParam, body: { required: true, content: json(patchProductBody, { specLowS: 2.9e-4, specHighS: 3.3e-4 }) } },
    responses: { 200: { description: "The product after the change", content: json(productSchema) }, ...errors(...AUTH_ERRORS, "not_found", ...JSON_BODY_ERRORS) },
  });

  registry.registerPath({
    method: "post",
    path: "/api/v1/products/{code}/limits",
    operationId: "freezeLimitSet",
    tags: ["Products"],
    summary: "Compute and freeze the next control-limit version",
    description: [
      "Computes limits from the baseline, for wafer median G (S) and wafer yield (0–1):",
      "an individuals chart with moving range (σ̂ = MR̄/d₂) and a lot-level X̄–S chart with wafers as the subgroup (c₄, A₃, B₃, B₄ for the subgroup size),",
      "then freezes them as the next numbered version with who and when. A baseline under 2 usable wafers is refused with 422.",
    ].join(" "),
    ...access("limits.freeze"),
    request: { params: productCodeParam, body: { required: true, content: json(limitBaselineBody, { lots: ["TW2611-0101", "TW2611-0102", "TW2611-0103"] }) } },
    responses: {
      201: { description: "The frozen version", content: json(limitSetSchema) },
      ...errors(...AUTH_ERRORS, "not_found", "conflict", ...JSON_BODY_ERRORS),
    },
  });

  registry.registerPath({
    method: "get",
    path: "/api/v1/products/{code}/limits",
    operationId: "listLimitSets",
    tags: ["Products"],
    summary: "List control-limit versions",
    ...access("data.read"),
    request: { params: productCodeParam },
    responses: { 200: { description: "The product's frozen versions", content: json(limitSetListSchema) }, ...errors(...AUTH_ERRORS, "not_found") },
  });
}
