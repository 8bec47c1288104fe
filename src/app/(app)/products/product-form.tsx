"use client";

import { useRouter } from "next/navigation";
import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage, SelectField, TextField } from "@/components/ui/field";
import { type ConductanceUnit, conductanceIn, UNIT_LABEL } from "@/lib/format";
import type { Product } from "@/lib/schemas/products";
import { saveProductAction } from "./actions";

const num = (v: number | null | undefined, digits = 6) => (v === null || v === undefined ? "" : String(Number(v.toPrecision(digits))));

/** Create or edit a product: every §5/§6 setting, conductances in the product's own unit. */
export function ProductForm({ product, customers, readOnly }: { product: Product | null; customers: { id: string; name: string }[]; readOnly: boolean }) {
  const router = useRouter();
  const [unit, setUnit] = useState<ConductanceUnit>(product?.displayUnit ?? "uS");
  const [state, submit, pending] = useActionState<Awaited<ReturnType<typeof saveProductAction>> | null, FormData>(async (_p, form) => {
    const result = await saveProductAction(form);
    if (result.ok && result.data.created) router.push(`/products/${encodeURIComponent(result.data.code)}`);
    return result;
  }, null);
  const e = state && !state.ok ? state.fieldErrors : undefined;
  const g = (v: number | null | undefined) => (v === null || v === undefined ? "" : num(conductanceIn(v, unit)));
  const u = UNIT_LABEL[unit];
  return (
    <form action={submit} noValidate className="space-y-5">
      <FormMessage result={state} />
      {state?.ok && !state.data.created ? <p role="status" className="text-sm text-[#00694d]">Saved.</p> : null}
      <fieldset disabled={readOnly || pending} className="grid gap-4 md:grid-cols-3">
        <TextField label="Code" name="code" defaultValue={product?.code} readOnly={Boolean(product)} required errors={e?.code} />
        <TextField label="Name" name="name" defaultValue={product?.name} required errors={e?.name} />
        <SelectField label="Customer" name="customerId" defaultValue={product?.customerId ?? ""} errors={e?.customerId}>
          <option value="">— internal —</option>
          {customers.map((c) => (
            <option key={c.id} value={c.id}>{c.name}</option>
          ))}
        </SelectField>
        <SelectField label="Conductance unit" name="displayUnit" value={unit} onChange={(ev) => setUnit(ev.target.value as ConductanceUnit)} hint="How limits are entered and shown; stored in S.">
          <option value="uS">µS</option>
          <option value="G0">G₀ = 2q²/h (conductance quantum)</option>
          <option value="S">S</option>
        </SelectField>
        <TextField label="Die width" unit="mm" name="dieWidthMm" inputMode="decimal" defaultValue={num(product?.dieWidthMm)} errors={e?.dieWidthMm} />
        <TextField label="Die height" unit="mm" name="dieHeightMm" inputMode="decimal" defaultValue={num(product?.dieHeightMm)} errors={e?.dieHeightMm} />
        <TextField label="Wafer diameter" unit="mm" name="waferDiameterMm" inputMode="decimal" defaultValue={num(product?.waferDiameterMm) || "150"} errors={e?.waferDiameterMm} />
        <TextField label="Edge exclusion" unit="mm" name="edgeExclusionMm" inputMode="decimal" defaultValue={num(product?.edgeExclusionMm) || "3"} errors={e?.edgeExclusionMm} />
        <TextField label="Spec low (LSL)" unit={u} name="specLow" inputMode="decimal" defaultValue={g(product?.specLowS)} errors={e?.specLowS} key={`sl-${unit}`} />
        <TextField label="Spec high (USL)" unit={u} name="specHigh" inputMode="decimal" defaultValue={g(product?.specHighS)} errors={e?.specHighS} key={`sh-${unit}`} />
        <TextField label="OPEN below" unit={u} name="openBelow" inputMode="decimal" defaultValue={g(product?.openBelowS)} errors={e?.openBelowS} key={`ob-${unit}`} />
        <TextField label="SHORT above" unit={u} name="shortAbove" inputMode="decimal" defaultValue={g(product?.shortAboveS)} errors={e?.shortAboveS} key={`sa-${unit}`} />
        <TextField label="Window factor w" name="windowFactor" inputMode="decimal" defaultValue={num(product?.windowFactor ?? 0.5)} hint="Fit window V_w = w·kT/q (±12.93 mV at 300 K for w = 0.5)." errors={e?.windowFactor} />
        <TextField label="Nonlinearity limit η_max" name="nonlinearityMax" inputMode="decimal" defaultValue={num(product?.nonlinearityMax ?? 0.02)} errors={e?.nonlinearityMax} />
        <TextField label="Yield floor" unit="%" name="yieldFloorPercent" inputMode="decimal" defaultValue={product?.yieldFloor === null || product?.yieldFloor === undefined ? "" : num(product.yieldFloor * 100)} errors={e?.yieldFloor} />
        <SelectField label="Control rules" name="rules" defaultValue={product?.rules ?? "western-electric"}>
          <option value="western-electric">Western Electric rules 1–4</option>
          <option value="nelson">Nelson rules 1–8</option>
        </SelectField>
        <SelectField label="Die window" name="dieWindow" defaultValue={product?.dieWindow ?? "pat"}>
          <option value="pat">Dynamic, per wafer (Part Average Testing)</option>
          <option value="static">Static, from the frozen baseline</option>
        </SelectField>
        <TextField label="Die window k" name="dieWindowK" inputMode="decimal" defaultValue={num(product?.dieWindowK)} hint="σ̂ multiples: default 6 for PAT, 3 for static." errors={e?.dieWindowK} />
      </fieldset>
      {readOnly ? <p className="text-sm text-ink-muted">Only engineers and admins change product settings.</p> : <Button type="submit" disabled={pending}>{product ? "Save changes" : "Create product"}</Button>}
    </form>
  );
}
