import { z } from "zod";
import { DEFAULT_WINDOW_FACTOR, type DeviceModelEvaluation } from "@/domain/device-model";
import { deviceModelSchema } from "./products";

// Each table knot costs the quadrature a panel at every temperature (about 1.7 µs per knot and temperature), so one
// request is capped at about 2 s of work: 500 temperatures for a 2000-point table, 25 for a 40 000-point one.
const MAX_KNOT_EVALUATIONS = 1_000_000;

/** POST /api/v1/device-models/evaluate (§9): a §8 model, μ in eV, temperatures in K, and w of V_w = w·kT/q. */
export const evaluateRequestSchema = z
  .object({
    model: deviceModelSchema,
    fermiLevelEv: z.number().finite().min(-100).max(100),
    temperaturesK: z.array(z.number().finite().min(0).max(2000)).min(1).max(500),
    windowFactor: z.number().positive().max(5).default(DEFAULT_WINDOW_FACTOR),
  })
  .superRefine((request, ctx) => {
    if (request.model.kind !== "table") return;
    const knots = request.model.points.length;
    if (knots * request.temperaturesK.length > MAX_KNOT_EVALUATIONS) {
      ctx.addIssue({
        code: "custom",
        path: ["temperaturesK"],
        message: `a ${knots}-point table can be evaluated at ${Math.floor(MAX_KNOT_EVALUATIONS / knots)} temperatures at most per request`,
      });
    }
  });
export type EvaluateRequest = z.infer<typeof evaluateRequestSchema>;

/** `{ fermiLevelEv, results: [{ temperatureK, conductanceS, modes, windowV, warnings }] }`, SI units as named. */
export type EvaluateResponse = DeviceModelEvaluation;
