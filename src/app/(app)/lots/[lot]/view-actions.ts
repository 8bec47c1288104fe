"use server";

import { revalidatePath } from "next/cache";
import { saveViewSchema, viewIdSchema } from "@/lib/schemas/views";
import { deleteView, saveView } from "@/server/db/queries/views";
import { withScope } from "@/server/db/scope";
import { appAction } from "@/server/http/action";

export const saveViewAction = appAction(saveViewSchema, { permission: "views.save" }, async (input, { scope }) => {
  const view = await withScope(scope, (tx) => saveView(tx, scope, input));
  revalidatePath(input.path);
  return view;
});

export const deleteViewAction = appAction(viewIdSchema, { permission: "views.save" }, async ({ viewId }, { scope }) => {
  await withScope(scope, (tx) => deleteView(tx, viewId));
  return { viewId };
});
