import { z } from "zod";
import type { BaselineLimitValues, NormalityHint } from "@/domain/spc";

// Limit sets (§6, issue 6): a baseline chosen by lots or by a probe-date range, reviewed, then frozen as a version.
const isoDate = z.string().trim().refine((v) => !Number.isNaN(Date.parse(v)), "Use an ISO 8601 date or time");
const lotNumber = z.string().trim().min(1).max(64);
const common = {
  note: z.string().trim().max(2000).optional(),
  /** true: compute and return the limits for review without freezing them. */
  preview: z.boolean().optional(),
  /** When the version comes into force (ISO 8601); default: when it is frozen. Not before the newest baseline lot. */
  inForceFrom: isoDate.optional(),
};

export const limitBaselineSchema = z.union([
  z.object({ lots: z.array(lotNumber).min(1).max(1000), ...common }).strict(),
  z
    .object({ from: isoDate, to: isoDate, ...common })
    .strict()
    .refine((b) => Date.parse(b.from) <= Date.parse(b.to), { path: ["to"], message: "to must not be before from" }),
]);
export type LimitBaseline = z.infer<typeof limitBaselineSchema>;

/** The freeze form: lots typed as a list (commas, spaces or new lines) or a date range. */
export const limitFormSchema = z
  .object({
    productCode: z.string().trim().min(1).max(40),
    mode: z.enum(["lots", "dates"]),
    lots: z.string().max(64_000).optional(),
    from: z.string().optional(),
    to: z.string().optional(),
    note: z.string().trim().max(2000).optional(),
  })
  .transform((f, ctx): { productCode: string; baseline: LimitBaseline } => {
    const baseline =
      f.mode === "lots"
        ? { lots: (f.lots ?? "").split(/[\s,;]+/).filter(Boolean), note: f.note || undefined }
        : { from: f.from ?? "", to: f.to ?? "", note: f.note || undefined };
    const parsed = limitBaselineSchema.safeParse(baseline);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) ctx.addIssue({ code: "custom", path: [String(issue.path[0] ?? f.mode)], message: issue.message });
      return z.NEVER;
    }
    return { productCode: f.productCode, baseline: parsed.data };
  });

export interface DieWindowView {
  lowS: number;
  highS: number;
  centerS: number;
  sigmaS: number;
  k: number;
}

export interface LimitComputation {
  lots: string[];
  lotCount: number;
  waferCount: number;
  dieCount: number;
  limits: BaselineLimitValues;
  dieWindow: DieWindowView | null;
  rules: "western-electric" | "nelson";
  /** Baseline die G histogram (parametric dies), edges in S. */
  histogram: { edgesS: number[]; counts: number[] };
  /** Jarque–Bera hint on the baseline wafer medians, the statistic the individuals chart plots. */
  normality: NormalityHint;
}

export interface LimitSetView extends Omit<LimitComputation, "histogram" | "normality"> {
  version: number;
  frozenAt: string;
  inForceFrom: string;
  frozenBy: string;
  baseline: { kind: "lots" | "dates"; from: string | null; to: string | null };
  note: string | null;
}
