"use client";

import { useRedirectingAction } from "@/hooks/use-redirecting-action";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { requestResetAction, resetPasswordAction } from "./actions";

export function RequestResetForm() {
  const [state, submit, pending] = useActionState<Awaited<ReturnType<typeof requestResetAction>> | null, FormData>((_p, form) => requestResetAction(form), null);
  if (state?.ok) {
    return <p className="mt-4 text-sm text-ink-soft" role="status">If that address has an account, a reset link is on its way. It works for 2 hours.</p>;
  }
  return (
    <form action={submit} className="mt-6 space-y-4" noValidate>
      <FormMessage result={state} />
      <TextField label="E-mail" name="email" type="email" autoComplete="username" required errors={state && !state.ok ? state.fieldErrors?.email : undefined} />
      <Button type="submit" disabled={pending} className="w-full py-2">Send reset link</Button>
    </form>
  );
}

export function NewPasswordForm({ token }: { token: string }) {
  const [state, submit, pending] = useRedirectingAction(resetPasswordAction);
  return (
    <form action={submit} className="mt-6 space-y-4" noValidate>
      <input type="hidden" name="token" value={token} />
      <FormMessage result={state} />
      <TextField label="New password" name="password" type="password" autoComplete="new-password" required hint="At least 12 characters. Signs you out everywhere else." errors={state && !state.ok ? state.fieldErrors?.password : undefined} />
      <Button type="submit" disabled={pending} className="w-full py-2">Set password and sign in</Button>
    </form>
  );
}
