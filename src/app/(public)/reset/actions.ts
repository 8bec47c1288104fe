"use server";

import { cookies } from "next/headers";
import { requestResetSchema, resetPasswordSchema } from "@/lib/schemas/auth";
import { requestPasswordReset, resetPassword } from "@/server/auth/password-reset";
import { publicAction } from "@/server/http/action";

export const requestResetAction = publicAction(requestResetSchema, async ({ email }) => {
  await requestPasswordReset(email);
  return { sent: true };
});

export const resetPasswordAction = publicAction(resetPasswordSchema, async ({ token, password }) => {
  const cookie = await resetPassword(token, password);
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
  return { next: "/" };
});
