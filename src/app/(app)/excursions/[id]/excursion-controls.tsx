"use client";

import { useActionState, useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import type { ExcursionStatus } from "@/lib/schemas/excursions";
import { commentExcursionAction, setExcursionOwnerAction, transitionExcursionAction } from "../actions";

type Result = Awaited<ReturnType<typeof transitionExcursionAction>> | null;

/** Acknowledge, or resolve with a root cause and note, showing the §12 caution before the decision. */
export function TransitionForms({ id, status }: { id: string; status: ExcursionStatus }) {
  const [ack, ackSubmit, ackPending] = useActionState<Result, FormData>((_p, form) => transitionExcursionAction(form), null);
  const [res, resSubmit, resPending] = useActionState<Result, FormData>((_p, form) => transitionExcursionAction(form), null);
  const errors = res && !res.ok ? res.fieldErrors : undefined;
  return (
    <div className="space-y-4">
      {status === "open" ? (
        <form action={ackSubmit}>
          <FormMessage result={ack} />
          <input type="hidden" name="id" value={id} />
          <input type="hidden" name="to" value="acknowledged" />
          <Button type="submit" variant="secondary" disabled={ackPending}>Acknowledge</Button>
        </form>
      ) : null}
      <form action={resSubmit} className="space-y-3 border-t border-slate-line pt-4" noValidate>
        <h3 className="text-sm font-semibold">Resolve</h3>
        <FormMessage result={res} />
        <input type="hidden" name="id" value={id} />
        <input type="hidden" name="to" value="resolved" />
        <TextField label="Root cause" name="rootCause" errors={errors?.rootCause} />
        <TextField label="Resolution note" name="note" errors={errors?.note} />
        <p className="rounded border border-caution/30 bg-caution-wash px-3 py-2 text-xs text-caution">
          SPC signals support the fab&apos;s quality system and never replace its disposition procedures; resolve this excursion under the fab&apos;s own procedures.
        </p>
        <Button type="submit" disabled={resPending}>{resPending ? "Resolving…" : "Resolve the excursion"}</Button>
      </form>
    </div>
  );
}

export function OwnerPicker({ id, ownerUserId, owners, disabled }: { id: string; ownerUserId: string | null; owners: { userId: string; name: string }[]; disabled: boolean }) {
  const [pending, startTransition] = useTransition();
  const [message, setMessage] = useState<string | null>(null);
  return (
    <label className="mb-4 block text-sm text-ink-soft">
      Owner
      <select
        aria-label="Owner"
        className="mt-1 block w-full rounded border border-slate-line bg-white px-2 py-1.5 text-sm text-ink"
        defaultValue={ownerUserId ?? ""}
        disabled={disabled || pending}
        onChange={(e) => startTransition(async () => {
          const result = await setExcursionOwnerAction({ id, ownerUserId: e.target.value });
          setMessage(result.ok ? null : result.message);
        })}
      >
        <option value="">Nobody yet</option>
        {owners.map((o) => <option key={o.userId} value={o.userId}>{o.name}</option>)}
      </select>
      {message ? <span role="alert" className="mt-1 block text-xs text-alert">{message}</span> : null}
    </label>
  );
}

export function CommentForm({ id }: { id: string }) {
  const [state, submit, pending] = useActionState<Awaited<ReturnType<typeof commentExcursionAction>> | null, FormData>((_p, form) => commentExcursionAction(form), null);
  return (
    <form action={submit} className="space-y-2" noValidate>
      <FormMessage result={state} />
      <input type="hidden" name="id" value={id} />
      <TextField label="Add a comment" name="body" errors={state && !state.ok ? state.fieldErrors?.body : undefined} />
      <Button type="submit" variant="secondary" disabled={pending}>Comment</Button>
    </form>
  );
}
