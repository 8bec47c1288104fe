"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { saveTenantSettingsAction } from "./actions";

export function TenantForm({ name, errorBudgetPercent }: { name: string; errorBudgetPercent: number }) {
  const [state, submit, pending] = useActionState<Awaited<ReturnType<typeof saveTenantSettingsAction>> | null, FormData>((_p, form) => saveTenantSettingsAction(form), null);
  const e = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form action={submit} className="max-w-md space-y-3" noValidate>
      <FormMessage result={state} />
      {state?.ok ? <p role="status" className="text-sm text-[#00694d]">Saved.</p> : null}
      <TextField label="Tenant name" name="name" defaultValue={name} required errors={e?.name} />
      <TextField label="Ingest error budget" unit="% of rows" name="errorBudgetPercent" inputMode="decimal" defaultValue={String(errorBudgetPercent)} errors={e?.errorBudgetPercent} hint="Bad rows up to this share of a file are skipped with a warning; more fail the whole file (default 0.1 %)." />
      <Button type="submit" disabled={pending}>Save</Button>
    </form>
  );
}
