"use client";

import { type ChangeEvent, useState, useTransition } from "react";
import { HistogramChart } from "@/components/charts/histogram-chart";
import { Button } from "@/components/ui/button";
import { FormMessage, SelectField, TextField } from "@/components/ui/field";
import { formatSi } from "@/domain/transport/format-si";
import type { LimitComputation } from "@/lib/schemas/limits";
import { freezeLimitsAction, previewLimitsAction } from "./actions";

type Preview = Awaited<ReturnType<typeof previewLimitsAction>>;
type Freeze = Awaited<ReturnType<typeof freezeLimitsAction>>;

/** Baseline by lots or dates → review (histogram, normality hint, limits) → freeze as the next version. */
export function FreezeLimitsForm({ productCode, recentLots }: { productCode: string; recentLots: string[] }) {
  const [mode, setMode] = useState<"lots" | "dates">("lots");
  const [fields, setFields] = useState({ lots: recentLots.join(", "), from: "", to: "", note: "" });
  const [preview, setPreview] = useState<Preview | null>(null);
  const [frozen, setFrozen] = useState<Freeze | null>(null);
  const [pending, startTransition] = useTransition();
  const input = { productCode, mode, ...fields };
  const errors = preview && !preview.ok ? preview.fieldErrors : undefined;
  const set = (name: keyof typeof fields) => (e: ChangeEvent<HTMLInputElement>) => {
    setFields({ ...fields, [name]: e.target.value });
    setPreview(null);
  };
  return (
    <div className="space-y-3 text-sm">
      <SelectField label="Baseline" name="mode" value={mode} onChange={(e) => { setMode(e.target.value as "lots" | "dates"); setPreview(null); }}>
        <option value="lots">Chosen lots</option>
        <option value="dates">Lots probed in a date range</option>
      </SelectField>
      {mode === "lots" ? (
        <TextField label="Lots" name="lots" value={fields.lots} onChange={set("lots")} errors={errors?.lots} hint="Lot numbers, separated by commas or spaces" />
      ) : (
        <div className="grid grid-cols-2 gap-3">
          <TextField label="From" name="from" type="date" value={fields.from} onChange={set("from")} errors={errors?.from} />
          <TextField label="To" name="to" type="date" value={fields.to} onChange={set("to")} errors={errors?.to} />
        </div>
      )}
      <TextField label="Note" name="note" value={fields.note} onChange={set("note")} />
      <FormMessage result={preview} />
      <Button variant="secondary" disabled={pending} onClick={() => startTransition(async () => { setFrozen(null); setPreview(await previewLimitsAction(input)); })}>
        {pending && !preview ? "Computing…" : "Compute for review"}
      </Button>
      {preview?.ok ? <Review computed={preview.data} /> : null}
      {preview?.ok ? (
        <div className="space-y-2 border-t border-slate-line pt-3">
          <p className="rounded border border-caution/30 bg-caution-wash px-3 py-2 text-xs text-caution">
            Limits follow the fab&apos;s own procedures and the customer&apos;s agreement; SPC signals support the quality system and never replace its disposition procedures. Freezing makes these the limits in force for every lot probed from now on.
          </p>
          <FormMessage result={frozen} />
          {frozen?.ok ? <p role="status" className="text-bin-pass">Frozen as version {frozen.data.version}.</p> : null}
          <Button disabled={pending || Boolean(frozen?.ok)} onClick={() => startTransition(async () => setFrozen(await freezeLimitsAction(input)))}>Freeze as the next version</Button>
        </div>
      ) : null}
    </div>
  );
}

function Review({ computed }: { computed: LimitComputation }) {
  const g = computed.limits.waferMedianConductanceS.individuals;
  const n = computed.normality;
  const edges = computed.histogram.edgesS.map((e) => e * 1e6);
  return (
    <div className="space-y-2 rounded border border-slate-line bg-white p-3">
      <p>{computed.lotCount} lots, {computed.waferCount} wafers, {computed.dieCount} measured dies.</p>
      {edges.length > 1 ? <HistogramChart edges={edges} series={[{ name: "Baseline dies", counts: computed.histogram.counts }]} valueTitle="G (µS)" ariaLabel="Baseline die conductance histogram" height={220} /> : null}
      <p className={n.verdict === "not normal-looking" ? "text-caution" : "text-ink-soft"}>
        Normality hint (wafer medians, Jarque–Bera): {n.verdict}
        {n.pValue !== null ? ` · p = ${n.pValue.toPrecision(2)}, skewness ${n.skewness?.toFixed(2)}, excess kurtosis ${n.excessKurtosis?.toFixed(2)}` : ""}
      </p>
      <dl className="grid grid-cols-2 gap-x-3 tabular-nums">
        <dt className="text-ink-muted">Centre (wafer median G)</dt><dd>{formatSi(g.center, "S")}</dd>
        <dt className="text-ink-muted">σ̂ = MR̄/d₂</dt><dd>{formatSi(g.sigma, "S")}</dd>
        <dt className="text-ink-muted">UCL / LCL</dt><dd>{formatSi(g.ucl, "S")} / {formatSi(g.lcl, "S")}</dd>
        {computed.dieWindow ? <><dt className="text-ink-muted">Static die window (k = {computed.dieWindow.k})</dt><dd>{formatSi(computed.dieWindow.lowS, "S")} – {formatSi(computed.dieWindow.highS, "S")}</dd></> : null}
        <dt className="text-ink-muted">Rules</dt><dd>{computed.rules === "nelson" ? "Nelson 1–8" : "Western Electric 1–4"}</dd>
      </dl>
    </div>
  );
}
