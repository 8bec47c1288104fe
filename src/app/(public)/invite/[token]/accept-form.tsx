"use client";

import { useRedirectingAction } from "@/hooks/use-redirecting-action";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { acceptInvitationAction } from "./actions";

export function AcceptForm({ token, email, existingUser }: { token: string; email: string; existingUser: boolean }) {
  const [state, submit, pending] = useRedirectingAction(acceptInvitationAction);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form action={submit} className="mt-6 space-y-4" noValidate>
      <input type="hidden" name="token" value={token} />
      <FormMessage result={state} />
      <TextField label="E-mail" name="email-shown" value={email} readOnly disabled />
      <TextField label="Your name" name="name" autoComplete="name" required errors={errors?.name} />
      <TextField
        label={existingUser ? "Your current password" : "Choose a password"}
        name="password"
        type="password"
        autoComplete={existingUser ? "current-password" : "new-password"}
        required
        errors={errors?.password}
        hint={existingUser ? "You already have an account: its password adds this tenant to it." : "At least 12 characters."}
      />
      <Button type="submit" disabled={pending} className="w-full py-2">
        {pending ? "Joining…" : "Accept and sign in"}
      </Button>
    </form>
  );
}
