"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import useSWR, { useSWRConfig } from "swr";
import { IvSweepChart } from "@/components/charts/iv-sweep-chart";
import { fitCubic } from "@/domain/transport";
import { fetcher, keys } from "@/lib/fetcher";
import { type ConductanceUnit, formatConductance } from "@/lib/format";
import type { DieRecord } from "@/lib/schemas/lots";
import { inkDiesAction } from "./actions";

function Row({ label, value }: { label: string; value: string }) {
  return (
    <div className="flex justify-between gap-4 border-b border-slate-line py-1.5 text-sm">
      <dt className="text-ink-soft">{label}</dt>
      <dd className="tabular text-right font-medium">{value}</dd>
    </div>
  );
}

const fmt = (v: number | null, digits = 4) => (v === null || !Number.isFinite(v) ? "—" : Number(v.toPrecision(digits)).toString());

/** The right-hand drawer for one die: its sweep with the fits and the thermal window, and every §5 value with units. */
export function DieDrawer({ lot, wafer, x, y, unit, canInk, onClose }: { lot: string; wafer: number; x: number; y: number; unit: ConductanceUnit; canInk: boolean; onClose: () => void }) {
  const { data, error } = useSWR<{ dies: DieRecord[] }>(keys.dies(lot, { wafer, x, y, include: "sweep" }), fetcher);
  const { mutate } = useSWRConfig();
  const router = useRouter();
  const [inkMessage, setInkMessage] = useState<string | null>(null);
  const [inking, startInk] = useTransition();
  const toggleInk = (inked: boolean) =>
    startInk(async () => {
      const result = await inkDiesAction({ lot, wafer, dies: [[x, y]], inked });
      setInkMessage(result.ok ? (inked ? "Inked: this die now counts as a fail in the shipped yield." : "Ink removed.") : result.message);
      await mutate((key) => typeof key === "string" && key.startsWith(`/api/v1/lots/${encodeURIComponent(lot)}/dies`));
      router.refresh();
    });
  const die = data?.dies[0];
  const points = die?.sweep ? die.sweep.biasV.map((biasV, i) => ({ biasV, currentA: die.sweep!.currentA[i]!, compliance: die.sweep!.compliance[i]! })) : [];
  const cubic = points.length ? fitCubic(points) : null;
  const maxBias = points.reduce((m, p) => Math.max(m, Math.abs(p.biasV)), 0);
  const leaves = die ? maxBias > die.windowV * (1 + 1e-9) : false;
  return (
    <aside aria-label={`Die ${x}, ${y} of wafer ${wafer}`} className="fixed right-0 top-0 z-30 h-screen w-[420px] max-w-full shrink-0 overflow-y-auto border-l border-slate-line bg-slate-panel p-5 shadow-xl 2xl:static 2xl:h-auto 2xl:shadow-none">
      <div className="flex items-start justify-between">
        <div>
          <p className="text-xs font-semibold uppercase tracking-[0.16em] text-ink-muted">Wafer {wafer}</p>
          <h2 className="text-lg font-semibold">Die ({x}, {y})</h2>
        </div>
        <button type="button" onClick={onClose} className="rounded px-2 py-1 text-sm text-ink-soft hover:bg-slate-wash" aria-label="Close die details">✕</button>
      </div>
      {error ? <p role="alert" className="mt-4 text-sm text-alert">{error.message}</p> : null}
      {!data && !error ? <p className="mt-4 text-sm text-ink-muted">Loading the sweep…</p> : null}
      {data && !die ? <p className="mt-4 text-sm text-ink-soft">There is no die at ({x}, {y}) on this wafer.</p> : null}
      {die ? (
        <>
          {die.conductanceS !== null && points.length ? (
            <div className="mt-3">
              <IvSweepChart points={points} fit={{ conductanceS: die.conductanceS, offsetA: die.offsetA ?? 0 }} cubic={cubic} windowV={die.windowV} ariaLabel={`I–V sweep of die ${x}, ${y}`} height={260} />
            </div>
          ) : null}
          <p className="mt-2 text-sm text-ink-soft">
            {leaves
              ? `The sweep goes to ±${(maxBias * 1e3).toFixed(1)} mV, beyond the thermal window of ±${(die.windowV * 1e3).toFixed(2)} mV: only the ${die.pointsInWindow} points inside it enter the conductance; the others show the nonlinearity.`
              : `The whole sweep stays inside the thermal window of ±${(die.windowV * 1e3).toFixed(2)} mV${die.nonlinearityWindowOnly ? ", so η comes from the window points alone" : ""}.`}
          </p>
          <dl className="mt-3">
            <Row label="Bin" value={die.bin} />
            {die.reason ? <Row label="Why" value={die.reason} /> : null}
            <Row label="Conductance G" value={formatConductance(die.conductanceS, unit)} />
            <Row label="G in S" value={die.conductanceS === null ? "—" : `${die.conductanceS.toExponential(4)} S`} />
            <Row label="G/G₀ (modes)" value={fmt(die.modes)} />
            <Row label="Offset I₀" value={die.offsetA === null ? "—" : `${die.offsetA.toExponential(3)} A`} />
            <Row label="R² of the window fit" value={fmt(die.r2, 6)} />
            <Row label="Points in window" value={`${die.pointsInWindow} of ${die.points}`} />
            <Row label="Window V_w" value={`±${(die.windowV * 1e3).toFixed(3)} mV`} />
            <Row label="Nonlinearity η" value={fmt(die.nonlinearity, 3)} />
            <Row label="Temperature" value={`${die.temperatureK.toFixed(2)} K`} />
            <Row label="Out of window" value={die.outOfWindow ? "yes" : "no"} />
            <Row label="Inked" value={die.inked ? "yes" : "no"} />
          </dl>
          {canInk ? (
            <div className="mt-4">
              <button type="button" disabled={inking} onClick={() => toggleInk(!die.inked)} className="rounded border border-slate-line px-3 py-1.5 text-sm hover:bg-slate-wash disabled:opacity-50">
                {die.inked ? "Remove ink" : "Ink this die"}
              </button>
              {inkMessage ? <p role="status" className="mt-2 text-xs text-ink-soft">{inkMessage}</p> : null}
            </div>
          ) : null}
        </>
      ) : null}
    </aside>
  );
}
