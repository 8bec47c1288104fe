import Link from "next/link";
import { Panel } from "@/components/ui/page-header";
import { formatDateTime, formatPercent } from "@/lib/format";
import type { LotJudgement } from "@/server/spc/lot-judgement";

const fmt = (v: number | null) => (v === null || !Number.isFinite(v) ? "—" : v.toFixed(2));

/** How the lot stands against its product's process control: the limit version in force, rule hits, capability. */
export function JudgementPanel({ judgement, openExcursions }: { judgement: LotJudgement; openExcursions: { id: string; title: string }[] }) {
  const { limitSet, hits, notes, yieldFloor, edge, capability } = judgement;
  const rings = edge.filter((e) => e.ring);
  return (
    <Panel title="Process control">
      <p className="text-sm">
        {limitSet ? (
          <>Judged against <Link className="font-medium text-accent underline" href={`/products/${encodeURIComponent(judgement.product)}`}>limits version {limitSet.version}</Link>, frozen {formatDateTime(limitSet.frozenAt)} by {limitSet.frozenBy} — the version in force when the lot was probed.</>
        ) : (
          <>No control limits were in force when this lot was probed.</>
        )}
      </p>
      {openExcursions.length ? (
        <ul className="mt-3 space-y-1 text-sm">
          {openExcursions.map((x) => (
            <li key={x.id} className="rounded border border-alert/30 bg-alert-wash px-3 py-1.5"><Link className="font-medium text-alert underline" href={`/excursions/${x.id}`}>Open excursion: {x.title}</Link></li>
          ))}
        </ul>
      ) : null}
      <ul className="mt-3 space-y-1 text-sm">
        {hits.map((h) => <li key={`${h.chart}-${h.wafer}-${h.rule}`}><span className="font-medium text-alert">{h.rule}</span> · {h.chart}{h.wafer !== null ? ` · wafer ${h.wafer}` : ""}: {h.description}</li>)}
        {limitSet && hits.length === 0 ? <li className="text-ink-soft">No control rule fired for this lot.</li> : null}
        {yieldFloor.broken ? <li className="text-alert">Lot yield {formatPercent(yieldFloor.lotYield)} is under the yield floor {formatPercent(yieldFloor.floor, 0)}.</li> : null}
        {rings.map((r) => <li key={r.wafer} className="text-alert">Wafer {r.wafer}: edge yield {formatPercent(r.edgeYield)} against centre {formatPercent(r.centreYield)} (an edge-ring signature).</li>)}
        {notes.map((n) => <li key={n} className="text-ink-muted">{n}</li>)}
      </ul>
      <div className="mt-3 text-sm">
        {capability.capability ? (
          <p className="tabular">Cp {fmt(capability.capability.cp)} · Cpk {fmt(capability.capability.cpk)} · Pp {fmt(capability.capability.pp)} · Ppk {fmt(capability.capability.ppk)} <span className="text-ink-muted">({capability.capability.sigmaNote})</span></p>
        ) : (
          <p className="text-ink-muted">Capability not computed: {capability.reason}.</p>
        )}
      </div>
      <p className="mt-3 text-xs text-ink-muted">SPC signals support the fab&apos;s quality system and never replace its disposition procedures.</p>
    </Panel>
  );
}
