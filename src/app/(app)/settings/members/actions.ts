"use server";

import { revalidatePath } from "next/cache";
import { changeRoleSchema, invitationIdSchema, inviteSchema, memberIdSchema } from "@/lib/schemas/members";
import { createInvitation } from "@/server/auth/invitations";
import { changeMemberRole, removeMember, withdrawInvitation } from "@/server/db/queries/members";
import { withScope } from "@/server/db/scope";
import { AppError } from "@/server/http/errors";
import { appAction } from "@/server/http/action";

export const inviteAction = appAction(inviteSchema, { permission: "invitations.manage" }, async (input, { scope }) => {
  const created = await createInvitation(scope, input);
  revalidatePath("/settings/members");
  return created;
});

export const changeRoleAction = appAction(changeRoleSchema, { permission: "members.manage" }, async ({ userId, role, customerId }, { scope }) => {
  await withScope(scope, (tx) => changeMemberRole(tx, scope, userId, role, customerId));
  revalidatePath("/settings/members");
  return { userId };
});

export const removeMemberAction = appAction(memberIdSchema, { permission: "members.manage" }, async ({ userId }, { scope }) => {
  if (userId === scope.userId) throw new AppError("conflict", "You cannot remove yourself; ask another admin.");
  await withScope(scope, (tx) => removeMember(tx, scope, userId));
  revalidatePath("/settings/members");
  return { userId };
});

export const withdrawInvitationAction = appAction(invitationIdSchema, { permission: "invitations.manage" }, async ({ invitationId }, { scope }) => {
  await withScope(scope, (tx) => withdrawInvitation(tx, scope, invitationId));
  revalidatePath("/settings/members");
  return { invitationId };
});
