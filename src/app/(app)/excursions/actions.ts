"use server";

import { revalidatePath } from "next/cache";
import { createExcursionSchema, excursionCommentSchema, excursionOwnerSchema, excursionTransitionSchema } from "@/lib/schemas/excursions";
import { addExcursionComment, setExcursionOwner, transitionExcursion } from "@/server/db/queries/excursions";
import { withScope } from "@/server/db/scope";
import { appAction } from "@/server/http/action";
import { raiseExcursionByHand } from "@/server/spc/manual-excursion";

export const raiseExcursionAction = appAction(createExcursionSchema, { permission: "excursions.manage" }, async (input, { scope }) => {
  const created = await raiseExcursionByHand(scope, input);
  revalidatePath("/excursions");
  return created;
});

export const transitionExcursionAction = appAction(excursionTransitionSchema, { permission: "excursions.manage" }, async (input, { scope }) => {
  await withScope(scope, (tx) => transitionExcursion(tx, scope, input));
  revalidatePath("/excursions", "layout");
  return { id: input.id };
});

export const commentExcursionAction = appAction(excursionCommentSchema, { permission: "excursions.comment" }, async ({ id, body }, { scope }) => {
  await withScope(scope, (tx) => addExcursionComment(tx, scope, id, body));
  revalidatePath("/excursions", "layout");
  return { id };
});

export const setExcursionOwnerAction = appAction(excursionOwnerSchema, { permission: "excursions.manage" }, async ({ id, ownerUserId }, { scope }) => {
  await withScope(scope, (tx) => setExcursionOwner(tx, scope, id, ownerUserId || null));
  revalidatePath("/excursions", "layout");
  return { id };
});
