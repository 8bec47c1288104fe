import { z } from "zod";

// The §9 product fields, in SI units (S, mm) as the API carries them.
const conductance = z.number().finite().nonnegative();
const optionalConductance = conductance.nullable().optional();

export const deviceModelSchema = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("step"),
    modes: z.number().int("modes is a whole number of channels").positive().max(10_000),
    transmission: z.number().min(0).max(1),
    edgeEv: z.number().finite().min(-100).max(100),
  }),
  z.object({
    kind: z.literal("table"),
    points: z.array(z.tuple([z.number().finite(), z.number().finite().nonnegative()])).min(2).max(100_000),
  }),
]);
export type DeviceModelInput = z.infer<typeof deviceModelSchema>;

const productFields = {
  name: z.string().trim().min(1).max(200),
  customerId: z.string().uuid().nullable().optional(),
  dieWidthMm: z.number().positive().max(100),
  dieHeightMm: z.number().positive().max(100),
  waferDiameterMm: z.number().positive().max(450),
  edgeExclusionMm: z.number().min(0).max(50).optional(),
  specLowS: optionalConductance,
  specHighS: optionalConductance,
  windowFactor: z.number().positive().max(5).optional(),
  nonlinearityMax: z.number().positive().max(10).optional(),
  openBelowS: optionalConductance,
  shortAboveS: optionalConductance,
  yieldFloor: z.number().min(0).max(1).nullable().optional(),
  rules: z.enum(["western-electric", "nelson"]).optional(),
  dieWindow: z.enum(["static", "pat"]).optional(),
  dieWindowK: z.number().positive().max(20).nullable().optional(),
  displayUnit: z.enum(["S", "uS", "G0"]).optional(),
  deviceModel: deviceModelSchema.nullable().optional(),
};

function specOrder<T extends { specLowS?: number | null; specHighS?: number | null; openBelowS?: number | null; shortAboveS?: number | null }>(p: T, ctx: z.RefinementCtx) {
  if (p.specLowS != null && p.specHighS != null && p.specLowS >= p.specHighS) ctx.addIssue({ code: "custom", path: ["specHighS"], message: "specHighS must be above specLowS" });
  if (p.openBelowS != null && p.shortAboveS != null && p.openBelowS >= p.shortAboveS) ctx.addIssue({ code: "custom", path: ["shortAboveS"], message: "shortAboveS must be above openBelowS" });
}

export const productCodeSchema = z
  .string()
  .trim()
  .min(1)
  .max(40)
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "Use letters, digits, dot, dash or underscore");

export const createProductSchema = z.object({ code: productCodeSchema, ...productFields }).superRefine(specOrder);
export type CreateProduct = z.infer<typeof createProductSchema>;

export const patchProductSchema = z.object(productFields).partial().superRefine(specOrder);
export type PatchProduct = z.infer<typeof patchProductSchema>;

export interface Product {
  code: string;
  name: string;
  customerId: string | null;
  customerName: string | null;
  dieWidthMm: number;
  dieHeightMm: number;
  waferDiameterMm: number;
  edgeExclusionMm: number;
  specLowS: number | null;
  specHighS: number | null;
  windowFactor: number;
  nonlinearityMax: number;
  openBelowS: number | null;
  shortAboveS: number | null;
  yieldFloor: number | null;
  rules: "western-electric" | "nelson";
  dieWindow: "static" | "pat";
  dieWindowK: number;
  displayUnit: "S" | "uS" | "G0";
  deviceModel: DeviceModelInput | null;
  updatedAt: string;
}

/** §6 defaults: k = 3 for the static window (median ± k·σ̂), 6 for Part Average Testing. */
export function defaultDieWindowK(kind: "static" | "pat"): number {
  return kind === "static" ? 3 : 6;
}
