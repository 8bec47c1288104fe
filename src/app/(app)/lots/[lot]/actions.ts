"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { dispositionFormSchema, inkSchema } from "@/lib/schemas/dispositions";
import { inkDies, setDisposition } from "@/server/db/queries/dispositions";
import { withScope } from "@/server/db/scope";
import { appAction } from "@/server/http/action";
import { kickMailer } from "@/server/mail/outbox";

export const setDispositionAction = appAction(dispositionFormSchema, { permission: "lots.disposition" }, async ({ lot, ...input }, { scope }) => {
  const result = await withScope(scope, (tx) => setDisposition(tx, scope, lot, input));
  if (result.notified > 0) kickMailer();
  revalidatePath(`/lots/${encodeURIComponent(lot)}`);
  return result;
});

export const inkDiesAction = appAction(inkSchema.extend({ lot: z.string().trim().min(1).max(64) }), { permission: "dies.ink" }, async ({ lot, ...input }, { scope }) => {
  const result = await withScope(scope, (tx) => inkDies(tx, scope, lot, input));
  revalidatePath(`/lots/${encodeURIComponent(lot)}`);
  return result;
});
