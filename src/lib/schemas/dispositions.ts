import { z } from "zod";

export const DISPOSITION_ACTIONS = ["hold", "release", "scrap"] as const;
export type DispositionAction = (typeof DISPOSITION_ACTIONS)[number];

const reason = z.string().trim().min(3, "Give a reason (at least 3 characters)").max(2000);

/** §9 `POST /api/v1/lots/{lot}/disposition`; overrideReason is needed to release a lot with an open excursion. */
export const dispositionSchema = z.object({
  action: z.enum(DISPOSITION_ACTIONS),
  reason,
  overrideReason: z.preprocess((v) => (v === "" ? undefined : v), reason.optional()),
});
export type Disposition = z.infer<typeof dispositionSchema>;

export const dispositionFormSchema = dispositionSchema.extend({ lot: z.string().trim().min(1).max(64) });

const dieIndex = z.number().int().min(-50_000).max(50_000);
export const inkSchema = z.object({
  wafer: z.number().int().min(1).max(25),
  dies: z.array(z.tuple([dieIndex, dieIndex])).min(1).max(100_000),
  inked: z.boolean(),
});
export type InkRequest = z.infer<typeof inkSchema>;

export const DISPOSITION_STATUS: Record<DispositionAction, "on hold" | "released" | "scrapped"> = {
  hold: "on hold",
  release: "released",
  scrap: "scrapped",
};

export interface DispositionRecord {
  action: DispositionAction;
  fromStatus: string;
  toStatus: string;
  reason: string;
  overrideReason: string | null;
  actor: string;
  at: string;
}
