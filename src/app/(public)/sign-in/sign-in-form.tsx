"use client";

import { useRouter } from "next/navigation";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { signInAction } from "./actions";

type State = Awaited<ReturnType<typeof signInAction>> | null;

export function SignInForm() {
  const router = useRouter();
  const [state, submit, pending] = useActionState<State, FormData>(async (_previous, form) => {
    const result = await signInAction(form);
    if (result.ok) router.replace(result.data.next);
    return result;
  }, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form action={submit} className="mt-6 space-y-4" noValidate>
      <FormMessage result={state} />
      <TextField label="E-mail" name="email" type="email" autoComplete="username" required errors={errors?.email} />
      <TextField label="Password" name="password" type="password" autoComplete="current-password" required errors={errors?.password} />
      <Button type="submit" disabled={pending} className="w-full py-2">
        {pending ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
