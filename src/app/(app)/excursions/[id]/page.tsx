import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ControlChart } from "@/components/charts/control-chart";
import { EmptyState, PageHeader, Panel } from "@/components/ui/page-header";
import { formatDateTime } from "@/lib/format";
import { can } from "@/lib/permissions";
import { TRIGGER_LABELS } from "@/lib/schemas/excursions";
import { requireContext } from "@/server/auth/context";
import { listAudit } from "@/server/db/queries/audit";
import { getExcursion, listPossibleOwners } from "@/server/db/queries/excursions";
import { withScope } from "@/server/db/scope";
import { AppError } from "@/server/http/errors";
import { getExcursionEvidence } from "@/server/spc/excursion-evidence";
import { StatusChip } from "../status-chip";
import { CommentForm, OwnerPicker, TransitionForms } from "./excursion-controls";

export const metadata: Metadata = { title: "Excursion" };

export default async function ExcursionPage({ params }: { params: Promise<{ id: string }> }) {
  const context = await requireContext("data.read");
  const { id } = await params;
  const loaded = await withScope(context.scope, async (tx) => {
    const excursion = await getExcursion(tx, decodeURIComponent(id));
    return {
      excursion,
      evidence: await getExcursionEvidence(tx, excursion.id),
      timeline: await listAudit(tx, { subjectType: "excursion", subjectId: excursion.id }),
      owners: await listPossibleOwners(tx, context.scope),
    };
  }).catch((error: unknown) => {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  });
  const { excursion: e, evidence, timeline, owners } = loaded;
  const canManage = can(context.role, "excursions.manage");
  const chart = e.trigger === "yield_floor" || e.trigger === "edge_ring" ? evidence?.yieldChart : evidence?.medianG;
  return (
    <>
      <PageHeader eyebrow={`Excursion ${e.number} · ${e.product} · ${TRIGGER_LABELS[e.trigger]}`} title={e.title}>
        <StatusChip status={e.status} />
      </PageHeader>
      <div className="grid gap-6 xl:grid-cols-[1fr_360px]">
        <div className="space-y-6">
          <Panel title={chart === evidence?.yieldChart ? "Evidence: wafer yield (%)" : `Evidence: wafer median G (${evidence?.conductanceUnit ?? ""})`}>
            {chart && evidence ? (
              <>
                <ControlChart {...chart} ariaLabel={`Control chart for excursion ${e.number}`} height={340} />
                <p className="mt-2 text-xs text-ink-muted">Limits version {evidence.version}; red triangles mark points that broke a rule. {evidence.notes.join(" ")}</p>
              </>
            ) : (
              <EmptyState>No control limits applied to these lots, so there is no chart to show.</EmptyState>
            )}
          </Panel>
          <Panel title="Linked lots and wafers">
            {e.linkedLots.length === 0 ? <EmptyState>No lots linked.</EmptyState> : (
              <table className="w-full text-sm tabular-nums">
                <thead className="text-left text-xs text-ink-muted [&_th]:pr-4"><tr><th className="py-1">Lot</th><th>Status</th><th>Wafers</th><th>Findings</th><th>Linked</th></tr></thead>
                <tbody className="divide-y divide-slate-line">
                  {e.linkedLots.map((l) => (
                    <tr key={l.lot} className="align-top [&_td]:pr-4">
                      <td className="whitespace-nowrap py-2"><Link className="text-accent hover:underline" href={`/lots/${encodeURIComponent(l.lot)}`}>{l.lot}</Link></td>
                      <td>{l.status}</td>
                      <td>{l.wafers.join(", ") || "—"}</td>
                      <td className="max-w-md">
                        <ul className="space-y-0.5">{l.findings.map((f, i) => <li key={i}><span className="font-medium">{f.rule ?? f.chart}</span>{f.wafer !== null ? ` · wafer ${f.wafer}` : ""} — {f.description} <span className="text-ink-muted">({f.chart})</span></li>)}</ul>
                      </td>
                      <td className="whitespace-nowrap text-ink-muted">{formatDateTime(l.addedAt)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
          </Panel>
          <Panel title="Comments">
            {e.comments.length === 0 ? <p className="mb-3 text-sm text-ink-muted">No comments yet.</p> : (
              <ul className="mb-4 space-y-3 text-sm">
                {e.comments.map((c) => <li key={c.id}><p className="text-xs text-ink-muted">{c.author} · {formatDateTime(c.at)}</p><p className="whitespace-pre-wrap">{c.body}</p></li>)}
              </ul>
            )}
            {can(context.role, "excursions.comment") ? <CommentForm id={e.id} /> : null}
          </Panel>
        </div>
        <div className="space-y-6">
          <Panel title="State">
            <dl className="mb-4 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
              <dt className="text-ink-muted">Opened</dt><dd>{formatDateTime(e.openedAt)} by {e.openedBy}</dd>
              <dt className="text-ink-muted">Acknowledged</dt><dd>{formatDateTime(e.acknowledgedAt)}</dd>
              <dt className="text-ink-muted">Resolved</dt><dd>{formatDateTime(e.resolvedAt)}</dd>
              {e.rootCause ? <><dt className="text-ink-muted">Root cause</dt><dd>{e.rootCause}</dd></> : null}
              {e.resolutionNote ? <><dt className="text-ink-muted">Note</dt><dd className="whitespace-pre-wrap">{e.resolutionNote}</dd></> : null}
              <dt className="text-ink-muted">Limits</dt><dd>{e.limitVersion ? `version ${e.limitVersion}` : "—"}</dd>
            </dl>
            <OwnerPicker id={e.id} ownerUserId={e.ownerUserId} owners={owners} disabled={!canManage || e.status === "resolved"} />
            {canManage && e.status !== "resolved" ? <TransitionForms id={e.id} status={e.status} /> : null}
          </Panel>
          <Panel title="Audit timeline">
            <ol className="space-y-2 border-l border-slate-line pl-3 text-sm">
              {timeline.map((t, i) => (
                <li key={i}>
                  <p className="font-medium">{t.action.replace("excursion.", "").replace("_", " ")}</p>
                  <p className="text-xs text-ink-muted">{formatDateTime(t.at)} · {t.actor}</p>
                </li>
              ))}
            </ol>
          </Panel>
        </div>
      </div>
    </>
  );
}
