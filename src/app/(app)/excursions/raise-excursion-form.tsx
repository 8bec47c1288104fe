"use client";

import { useRouter } from "next/navigation";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage, SelectField, TextField } from "@/components/ui/field";
import { raiseExcursionAction } from "./actions";

export function RaiseExcursionForm({ products }: { products: string[] }) {
  const router = useRouter();
  const [state, submit, pending] = useActionState<Awaited<ReturnType<typeof raiseExcursionAction>> | null, FormData>(async (_p, form) => {
    const result = await raiseExcursionAction(form);
    if (result.ok) router.push(`/excursions/${result.data.number}`);
    return result;
  }, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form action={submit} className="space-y-3" noValidate>
      <FormMessage result={state} />
      <SelectField label="Product" name="product" defaultValue="" errors={errors?.product}>
        <option value="" disabled>Choose…</option>
        {products.map((p) => <option key={p} value={p}>{p}</option>)}
      </SelectField>
      <TextField label="Title" name="title" errors={errors?.title} placeholder="e.g. Probe card wear suspected" />
      <TextField label="Lots" name="lots" errors={errors?.lots} hint="Lot numbers, separated by commas or spaces" />
      <TextField label="First note" name="note" errors={errors?.note} />
      <Button type="submit" disabled={pending}>{pending ? "Raising…" : "Raise the excursion"}</Button>
      <p className="text-xs text-ink-muted">The product&apos;s watch list hears of it by e-mail.</p>
    </form>
  );
}
