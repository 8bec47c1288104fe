"use server";

import { cookies } from "next/headers";
import { acceptInvitationSchema } from "@/lib/schemas/auth";
import { acceptInvitation } from "@/server/auth/invitations";
import { publicAction } from "@/server/http/action";

export const acceptInvitationAction = publicAction(acceptInvitationSchema, async (input) => {
  const cookie = await acceptInvitation(input);
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
  return { next: "/" };
});
