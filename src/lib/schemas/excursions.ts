import { z } from "zod";

export const EXCURSION_STATUSES = ["open", "acknowledged", "resolved"] as const;
export type ExcursionStatus = (typeof EXCURSION_STATUSES)[number];
export const EXCURSION_TRIGGERS = ["rule", "yield_floor", "edge_ring", "manual"] as const;
export type ExcursionTrigger = (typeof EXCURSION_TRIGGERS)[number];

export const TRIGGER_LABELS: Record<ExcursionTrigger, string> = {
  rule: "Control rule",
  yield_floor: "Yield floor",
  edge_ring: "Edge ring",
  manual: "Raised by hand",
};

export const excursionFiltersSchema = z.object({
  status: z.enum(EXCURSION_STATUSES).optional(),
  product: z.string().trim().max(40).optional(),
});
export type ExcursionFilters = z.infer<typeof excursionFiltersSchema>;

const text = (max: number) => z.string().trim().min(1, "Required").max(max);

/** Raising one by hand: a product, a title, optionally lots (numbers) and a first note. */
export const createExcursionSchema = z.object({
  product: text(40),
  title: text(200),
  lots: z.union([z.array(text(64)), z.string().transform((v) => v.split(/[\s,;]+/).filter(Boolean))]).default([]),
  note: z.string().trim().max(4000).optional(),
});
export type CreateExcursion = z.infer<typeof createExcursionSchema>;

export const excursionTransitionSchema = z.discriminatedUnion("to", [
  z.object({ id: z.string().uuid(), to: z.literal("acknowledged") }),
  z.object({ id: z.string().uuid(), to: z.literal("resolved"), rootCause: text(500), note: text(4000) }),
]);
export type ExcursionTransition = z.infer<typeof excursionTransitionSchema>;

export const excursionCommentSchema = z.object({ id: z.string().uuid(), body: text(4000) });
export const excursionOwnerSchema = z.object({ id: z.string().uuid(), ownerUserId: z.string().uuid().or(z.literal("")) });

export interface ExcursionFinding {
  /** e.g. "individuals: wafer median G", "X̄: lot mean of wafer median G", "yield floor", "edge vs centre". */
  chart: string;
  rule: string | null;
  description: string;
  wafer: number | null;
  value: number | null;
}

export interface ExcursionListItem {
  id: string;
  number: number;
  status: ExcursionStatus;
  product: string;
  trigger: ExcursionTrigger;
  title: string;
  lots: string[];
  owner: string | null;
  openedAt: string;
  updatedAt: string;
}

export interface ExcursionDetail extends ExcursionListItem {
  ownerUserId: string | null;
  openedBy: string;
  acknowledgedAt: string | null;
  resolvedAt: string | null;
  rootCause: string | null;
  resolutionNote: string | null;
  limitVersion: number | null;
  evidence: Record<string, unknown>;
  linkedLots: { lot: string; status: string; wafers: number[]; findings: ExcursionFinding[]; addedAt: string }[];
  comments: { id: string; author: string; body: string; at: string }[];
}
