"use client";

import { useRedirectingAction } from "@/hooks/use-redirecting-action";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { signInAction } from "./actions";

export function SignInForm() {
  const [state, submit, pending] = useRedirectingAction(signInAction);
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
