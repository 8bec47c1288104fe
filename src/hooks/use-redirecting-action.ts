"use client";

import { useRouter } from "next/navigation";
import { useActionState } from "react";

type Result = { ok: true; data: { next: string } } | { ok: false; message: string; fieldErrors?: Record<string, string[]> };

/** A form's server action that, on success, moves on to the page the action names (sign-in, invitation, reset). */
export function useRedirectingAction<R extends Result>(action: (form: FormData) => Promise<R>) {
  const router = useRouter();
  return useActionState<R | null, FormData>(async (_previous, form) => {
    const result = await action(form);
    if (result.ok) router.replace(result.data.next);
    return result;
  }, null);
}
