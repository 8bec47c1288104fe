"use client";

import type { ReactNode } from "react";
import type { RadialZone } from "@/domain/yield/geometry";
import type { Bin } from "@/domain/yield/yield";
import { type ConductanceUnit, UNIT_LABEL } from "@/lib/format";

/** One die as the analysis views use it: position, parsed bin, conductance in S and its wafer's radial zone. */
export interface AnalysisDie {
  x: number;
  y: number;
  bin: Bin;
  conductanceS: number | null;
  zone: RadialZone;
}

export interface AnalysisWafer {
  wafer: number;
  dies: AnalysisDie[];
}

/** The plain-language caption under a view's heading: what it shows and how it was computed. */
export function Caption({ children }: { children: ReactNode }) {
  return <p className="mb-3 max-w-3xl text-sm text-ink-soft">{children}</p>;
}

export function EmptyState({ children }: { children: ReactNode }) {
  return <p className="rounded border border-dashed border-slate-line px-4 py-6 text-center text-sm text-ink-muted">{children}</p>;
}

/** Wafer checkboxes with "All" and "None"; the parent keeps the chosen set. */
export function WaferPicker({ wafers, chosen, onChange, label }: { wafers: readonly number[]; chosen: ReadonlySet<number>; onChange: (next: Set<number>) => void; label: string }) {
  const toggle = (wafer: number) => {
    const next = new Set(chosen);
    if (next.has(wafer)) next.delete(wafer);
    else next.add(wafer);
    onChange(next);
  };
  return (
    <fieldset className="mb-3 flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
      <legend className="sr-only">{label}</legend>
      <span className="text-ink-soft" aria-hidden>{label}:</span>
      {wafers.map((w) => (
        <label key={w} className="tabular inline-flex items-center gap-1">
          <input type="checkbox" checked={chosen.has(w)} onChange={() => toggle(w)} className="accent-accent" />W{w}
        </label>
      ))}
      <button type="button" className="text-accent hover:underline" onClick={() => onChange(new Set(wafers))}>All</button>
      <button type="button" className="text-accent hover:underline" onClick={() => onChange(new Set())}>None</button>
    </fieldset>
  );
}

export const TABLE = "tabular w-full border-collapse text-sm";
export const TH = "border-b border-slate-line px-2 py-1.5 text-left text-xs font-semibold uppercase tracking-wide text-ink-muted";
export const TD = "border-b border-slate-line px-2 py-1.5";
export const TD_NUM = "border-b border-slate-line px-2 py-1.5 text-right";

/** A value already in the display unit, printed with the unit: 4 significant figures (exponent form for S). */
export function formatInUnit(value: number | null, unit: ConductanceUnit): string {
  if (value === null || !Number.isFinite(value)) return "—";
  const text = unit === "S" ? value.toExponential(3) : Number(value.toPrecision(4)).toString();
  return `${text} ${UNIT_LABEL[unit]}`;
}

/** A difference of two fractions in percentage points, signed: "+12.5 pp". */
export function formatPoints(difference: number | null): string {
  if (difference === null || !Number.isFinite(difference)) return "—";
  const points = 100 * difference;
  return `${points > 0 ? "+" : points < 0 ? "−" : ""}${Math.abs(points).toFixed(1)} pp`;
}
