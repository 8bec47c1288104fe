import "server-only";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { access, AUTH_ERRORS, errors, json, JSON_BODY_ERRORS } from "./components";
import { deviceModelBody } from "./schemas-products";
import { z } from "./zod-openapi";

// The evaluate request and answer of §8/§9; the handler and its shared schema are being added alongside this
// document. The model itself is the product schema's deviceModelSchema.
const evaluateBody = z
  .object({
    model: deviceModelBody,
    fermiLevelEv: z.number().min(-100).max(100).describe("Fermi level μ, in eV, on the same axis as the model's energies"),
    temperaturesK: z.array(z.number().min(0).max(2000)).min(1).max(500).describe("Temperatures to evaluate, in K, each 0–2000 K"),
    windowFactor: z.number().positive().default(0.5).describe("w of the suggested bias window V_w = w·kT/q"),
  })
  .openapi("EvaluateDeviceModel");

const evaluationSchema = z
  .object({
    fermiLevelEv: z.number().describe("μ, in eV, as requested"),
    results: z.array(
      z.object({
        temperatureK: z.number().describe("T, in K"),
        conductanceS: z.number().describe("Expected linear-response G = ∫ G(E)·F_T(E − μ) dE, in S; G(μ) at T = 0"),
        modes: z.number().describe("G/G₀ with G₀ = 2q²/h ≈ 7.748091729e-5 S"),
        windowV: z.number().describe("Suggested bias window w·kT/q, in V"),
        warnings: z.array(z.string()).describe("E.g. a table that does not span μ ± several kT"),
      }),
    ),
  })
  .openapi("DeviceModelEvaluation");

export function registerDeviceModelPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "post",
    path: "/api/v1/device-models/evaluate",
    operationId: "evaluateDeviceModel",
    tags: ["Device models"],
    summary: "Expected conductance of a device model",
    description:
      "Integrates the model's G(E) against the thermal broadening function F_T = −∂f/∂E at each temperature. For the step model G = M𝒯G₀/(1 + e^((E_c − μ)/kT)).",
    ...access("data.read"),
    request: {
      body: {
        required: true,
        content: json(evaluateBody, { model: { kind: "step", modes: 4, transmission: 0.95, edgeEv: -0.05 }, fermiLevelEv: 0, temperaturesK: [4, 77, 300] }),
      },
    },
    responses: { 200: { description: "One result per requested temperature, in order", content: json(evaluationSchema) }, ...errors(...AUTH_ERRORS, ...JSON_BODY_ERRORS) },
  });
}
