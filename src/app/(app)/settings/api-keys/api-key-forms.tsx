"use client";

import { useActionState, useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage, SelectField, TextField } from "@/components/ui/field";
import { EmptyState } from "@/components/ui/page-header";
import { formatDateTime } from "@/lib/format";
import { ROLE_LABELS, ROLES } from "@/lib/permissions";
import type { ApiKeyView } from "@/lib/schemas/members";
import { createApiKeyAction, revokeApiKeyAction } from "./actions";

export function CreateKeyForm({ customers }: { customers: { id: string; name: string }[] }) {
  const [role, setRole] = useState<string>("engineer");
  const [state, submit, pending] = useActionState<Awaited<ReturnType<typeof createApiKeyAction>> | null, FormData>((_p, form) => createApiKeyAction(form), null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form action={submit} className="space-y-3" noValidate>
      <FormMessage result={state} />
      {state?.ok ? (
        <div role="status" className="rounded border border-caution/40 bg-caution-wash p-3 text-sm">
          <p className="font-medium">Copy the key now: it will not be shown again.</p>
          <code data-testid="new-api-key" className="mt-2 block break-all rounded bg-white p-2 text-xs">{state.data.key}</code>
        </div>
      ) : null}
      <TextField label="Name" name="name" placeholder="e.g. PRB-03 station" required errors={errors?.name} />
      <SelectField label="Role" name="role" value={role} onChange={(e) => setRole(e.target.value)}>
        {ROLES.map((r) => (
          <option key={r} value={r}>{ROLE_LABELS[r]}</option>
        ))}
      </SelectField>
      {role === "customer" ? (
        <SelectField label="Customer account" name="customerId" defaultValue="" errors={errors?.customerId}>
          <option value="" disabled>Choose…</option>
          {customers.map((c) => (
            <option key={c.id} value={c.id}>{c.name}</option>
          ))}
        </SelectField>
      ) : null}
      <Button type="submit" disabled={pending}>Create key</Button>
    </form>
  );
}

export function ApiKeyList({ keys }: { keys: ApiKeyView[] }) {
  const [pending, startTransition] = useTransition();
  if (keys.length === 0) return <EmptyState>No API keys yet. Make one for each station or script, so each can be revoked on its own.</EmptyState>;
  return (
    <table className="w-full text-left text-sm">
      <thead className="border-b border-slate-line text-xs uppercase tracking-wide text-ink-muted">
        <tr>
          <th className="py-2 font-medium">Name</th>
          <th className="font-medium">Prefix</th>
          <th className="font-medium">Role</th>
          <th className="font-medium">Created by</th>
          <th className="font-medium">Last used</th>
          <th className="font-medium"><span className="sr-only">Actions</span></th>
        </tr>
      </thead>
      <tbody className="divide-y divide-slate-line">
        {keys.map((k) => (
          <tr key={k.id} className={k.revokedAt ? "text-ink-muted" : ""}>
            <td className="py-2 font-medium">{k.name}</td>
            <td><code className="text-xs">{k.prefix}…</code></td>
            <td>{ROLE_LABELS[k.role]}</td>
            <td>{k.createdBy ?? "—"}</td>
            <td className="tabular">{k.lastUsedAt ? formatDateTime(k.lastUsedAt) : "never"}</td>
            <td className="text-right">
              {k.revokedAt ? (
                <span className="text-xs">revoked {formatDateTime(k.revokedAt)}</span>
              ) : (
                <Button variant="danger" disabled={pending} onClick={() => confirm(`Revoke "${k.name}"? Anything using it stops working at once.`) && startTransition(async () => void (await revokeApiKeyAction({ keyId: k.id })))}>
                  Revoke
                </Button>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
