"use client";

import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { createCustomerAction } from "./actions";

export function CustomerForm() {
  const [state, submit, pending] = useActionState<Awaited<ReturnType<typeof createCustomerAction>> | null, FormData>((_p, form) => createCustomerAction(form), null);
  return (
    <form action={submit} className="space-y-3" noValidate>
      <FormMessage result={state} />
      {state?.ok ? <p role="status" className="text-sm text-[#00694d]">Added {state.data.name}.</p> : null}
      <TextField label="Customer name" name="name" required errors={state && !state.ok ? state.fieldErrors?.name : undefined} />
      <Button type="submit" disabled={pending}>Add customer</Button>
    </form>
  );
}
