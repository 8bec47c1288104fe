"use client";

import Link from "next/link";
import { type FormEvent, useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { FormMessage, SelectField, TextField } from "@/components/ui/field";
import { formatDateTime } from "@/lib/format";
import type { DispositionAction, DispositionRecord } from "@/lib/schemas/dispositions";
import { setDispositionAction } from "./actions";

export interface DispositionPanelProps {
  lot: string;
  status: string;
  releasedAt: string | null;
  openExcursions: { id: string; title: string }[];
  history: DispositionRecord[];
  /** False for analysts: the history shows, the form does not. */
  canDispose: boolean;
}

const CHOICES: Record<string, DispositionAction[]> = {
  receiving: ["hold", "scrap"],
  probed: ["hold", "release", "scrap"],
  "on hold": ["release", "scrap"],
  released: ["hold"],
  scrapped: [],
};
const LABELS: Record<DispositionAction, string> = { hold: "Put on hold", release: "Release to the customer", scrap: "Scrap" };

type DispositionResult = Awaited<ReturnType<typeof setDispositionAction>>;

/**
 * Hold, release or scrap a lot (§6) with a reason; an open excursion asks for an override reason before release.
 * The outcome message lives here, outside the form: a success changes the lot's status, and the form below is
 * keyed by that status so it starts fresh (choices, reason) while the message stays on screen.
 */
export function DispositionPanel({ lot, status, releasedAt, openExcursions, history, canDispose }: DispositionPanelProps) {
  const [state, setState] = useState<DispositionResult | null>(null);
  const choices = CHOICES[status] ?? [];
  return (
    <div className="space-y-4 text-sm">
      <p>
        Status <span className="font-semibold">{status}</span>
        {releasedAt ? <span className="text-ink-muted"> · released {formatDateTime(releasedAt)}</span> : null}
      </p>
      {openExcursions.length > 0 ? (
        <div className="rounded border border-alert/30 bg-alert-wash px-3 py-2 text-alert">
          <p className="font-medium">Open excursions on this lot</p>
          <ul>{openExcursions.map((e) => <li key={e.id}><Link className="underline" href={`/excursions/${e.id}`}>{e.title}</Link></li>)}</ul>
        </div>
      ) : null}
      {canDispose ? (
        <div className="space-y-3">
          <FormMessage result={state} />
          {state?.ok ? <p role="status" className="text-bin-pass">Lot is now {state.data.status}{state.data.notified ? `; ${state.data.notified} customer user(s) notified` : ""}.</p> : null}
          {choices.length > 0 ? <DispositionForm key={status} lot={lot} choices={choices} hasOpenExcursions={openExcursions.length > 0} state={state} onResult={setState} /> : null}
        </div>
      ) : null}
      {history.length > 0 ? (
        <ol className="space-y-1 border-t border-slate-line pt-3">
          {history.map((h, i) => (
            <li key={i}>
              <span className="font-medium">{h.action}</span> {h.fromStatus} → {h.toStatus} · {h.actor} · <span className="text-ink-muted">{formatDateTime(h.at)}</span>
              <p className="text-ink-soft">{h.reason}{h.overrideReason ? ` (override: ${h.overrideReason})` : ""}</p>
            </li>
          ))}
        </ol>
      ) : null}
    </div>
  );
}

interface DispositionFormProps {
  lot: string;
  choices: DispositionAction[];
  hasOpenExcursions: boolean;
  state: DispositionResult | null;
  onResult: (result: DispositionResult) => void;
}

function DispositionForm({ lot, choices, hasOpenExcursions, state, onResult }: DispositionFormProps) {
  const [action, setAction] = useState<DispositionAction | "">(choices[0] ?? "");
  const [pending, startTransition] = useTransition();
  // onSubmit rather than a form action: a refused release keeps what was typed (form actions reset the form).
  const submit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    startTransition(async () => onResult(await setDispositionAction(form)));
  };
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  const needsOverride = action === "release" && hasOpenExcursions;
  return (
    <form onSubmit={submit} className="space-y-3" noValidate>
      <input type="hidden" name="lot" value={lot} />
      <SelectField label="Disposition" name="action" value={action} onChange={(e) => setAction(e.target.value as DispositionAction)} errors={errors?.action}>
        {choices.map((c) => <option key={c} value={c}>{LABELS[c]}</option>)}
      </SelectField>
      <TextField label="Reason" name="reason" errors={errors?.reason} />
      {needsOverride ? <TextField label="Override reason (open excursion)" name="overrideReason" errors={errors?.overrideReason} hint="Why the lot may ship while its excursion is still open" /> : null}
      {action === "release" ? (
        <p className="rounded border border-caution/30 bg-caution-wash px-3 py-2 text-xs text-caution">
          Releases follow the fab&apos;s own procedures and the customer&apos;s agreement; SPC signals support the quality system and never replace its disposition procedures. The customer&apos;s users are e-mailed a link to the lot report.
        </p>
      ) : null}
      <Button type="submit" variant={action === "scrap" ? "danger" : "primary"} disabled={pending || !action}>{pending ? "Saving…" : action ? LABELS[action] : "Choose"}</Button>
    </form>
  );
}
