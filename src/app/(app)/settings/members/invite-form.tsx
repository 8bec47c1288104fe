"use client";

import { useActionState, useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage, SelectField, TextField } from "@/components/ui/field";
import { EmptyState } from "@/components/ui/page-header";
import { formatDate } from "@/lib/format";
import { ROLE_LABELS, ROLES } from "@/lib/permissions";
import type { InvitationRow } from "@/lib/schemas/members";
import { inviteAction, withdrawInvitationAction } from "./actions";

export function InviteForm({ customers }: { customers: { id: string; name: string }[] }) {
  const [role, setRole] = useState("engineer");
  const [state, submit, pending] = useActionState<Awaited<ReturnType<typeof inviteAction>> | null, FormData>((_p, form) => inviteAction(form), null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form action={submit} className="space-y-3" noValidate>
      <FormMessage result={state} />
      {state?.ok ? <p role="status" className="text-sm text-bin-pass">Invitation sent. The link expires in 7 days.</p> : null}
      <TextField label="E-mail" name="email" type="email" required errors={errors?.email} />
      <SelectField label="Role" name="role" value={role} onChange={(e) => setRole(e.target.value)} errors={errors?.role}>
        {ROLES.map((r) => (
          <option key={r} value={r}>{ROLE_LABELS[r]}</option>
        ))}
      </SelectField>
      {role === "customer" ? (
        <SelectField label="Customer account" name="customerId" errors={errors?.customerId} defaultValue="">
          <option value="" disabled>Choose…</option>
          {customers.map((c) => (
            <option key={c.id} value={c.id}>{c.name}</option>
          ))}
        </SelectField>
      ) : null}
      <Button type="submit" disabled={pending}>{pending ? "Sending…" : "Send invitation"}</Button>
    </form>
  );
}

export function InvitationList({ invitations }: { invitations: InvitationRow[] }) {
  const [pending, startTransition] = useTransition();
  if (invitations.length === 0) return <EmptyState>No invitations yet.</EmptyState>;
  return (
    <ul className="divide-y divide-slate-line text-sm">
      {invitations.map((i) => (
        <li key={i.id} className="flex items-center justify-between gap-2 py-2">
          <div className="min-w-0">
            <p className="truncate font-medium">{i.email}</p>
            <p className="text-xs text-ink-muted">{ROLE_LABELS[i.role]} · {i.state} · sent {formatDate(i.createdAt)}</p>
          </div>
          {i.state === "pending" ? (
            <Button variant="quiet" disabled={pending} onClick={() => startTransition(async () => void (await withdrawInvitationAction({ invitationId: i.id })))}>
              Withdraw
            </Button>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
