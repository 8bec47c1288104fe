"use server";

import { cookies, headers } from "next/headers";
import { signInSchema } from "@/lib/schemas/auth";
import { clientAddress, signIn } from "@/server/auth/sign-in";
import { publicAction } from "@/server/http/action";

export const signInAction = publicAction(signInSchema, async (input) => {
  const { cookie } = await signIn(input, clientAddress(await headers()));
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
  return { next: "/" };
});
