import { z } from "zod";
import { conductanceFromUnit } from "../format";
import { createProductSchema } from "./products";

// The product form speaks the product's display unit (µS, G₀ or S) and mm; the API and database speak SI.
const optionalNumber = z.preprocess((v) => (v === "" || v === undefined || v === null ? null : Number(v)), z.number({ message: "Enter a number" }).finite().nullable());
const requiredNumber = z.preprocess((v) => (v === "" || v === undefined ? undefined : Number(v)), z.number({ message: "Enter a number" }).finite());

export const productFormSchema = z
  .object({
    code: z.string().trim(),
    name: z.string().trim(),
    customerId: z.string().transform((v) => (v === "" ? null : v)),
    displayUnit: z.enum(["S", "uS", "G0"]),
    dieWidthMm: requiredNumber,
    dieHeightMm: requiredNumber,
    waferDiameterMm: requiredNumber,
    edgeExclusionMm: requiredNumber,
    specLow: optionalNumber,
    specHigh: optionalNumber,
    openBelow: optionalNumber,
    shortAbove: optionalNumber,
    windowFactor: requiredNumber,
    nonlinearityMax: requiredNumber,
    yieldFloorPercent: optionalNumber,
    rules: z.enum(["western-electric", "nelson"]),
    dieWindow: z.enum(["static", "pat"]),
    dieWindowK: optionalNumber,
  })
  .transform((f) => {
    const s = (v: number | null) => (v === null ? null : conductanceFromUnit(v, f.displayUnit));
    return {
      code: f.code,
      name: f.name,
      customerId: f.customerId,
      displayUnit: f.displayUnit,
      dieWidthMm: f.dieWidthMm,
      dieHeightMm: f.dieHeightMm,
      waferDiameterMm: f.waferDiameterMm,
      edgeExclusionMm: f.edgeExclusionMm,
      specLowS: s(f.specLow),
      specHighS: s(f.specHigh),
      openBelowS: s(f.openBelow),
      shortAboveS: s(f.shortAbove),
      windowFactor: f.windowFactor,
      nonlinearityMax: f.nonlinearityMax,
      yieldFloor: f.yieldFloorPercent === null ? null : f.yieldFloorPercent / 100,
      rules: f.rules,
      dieWindow: f.dieWindow,
      dieWindowK: f.dieWindowK,
    };
  })
  .transform((product, ctx) => {
    const checked = createProductSchema.safeParse(product);
    if (checked.success) return checked.data;
    for (const issue of checked.error.issues) ctx.addIssue({ code: "custom", path: issue.path as (string | number)[], message: issue.message });
    return z.NEVER;
  });
