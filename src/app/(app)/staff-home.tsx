import Link from "next/link";
import { Sparkline } from "@/components/charts/sparkline";
import { EmptyState, PageHeader, Panel } from "@/components/ui/page-header";
import { formatConductance, formatDateTime, formatPercent } from "@/lib/format";
import type { AuthContext } from "@/server/auth/context";
import { getAttention, getProductTrends } from "@/server/db/queries/home";
import { listExcursions } from "@/server/db/queries/excursions";
import { listLots } from "@/server/db/queries/lots";
import { withScope } from "@/server/db/scope";

const lotLink = (lot: string) => <Link className="font-medium text-accent underline-offset-2 hover:underline" href={`/lots/${encodeURIComponent(lot)}`}>{lot}</Link>;

/** Engineers' and analysts' front door: what needs attention first, then recent lots and product trends. */
export async function StaffHome({ context }: { context: AuthContext }) {
  const { attention, recent, trends, excursions } = await withScope(context.scope, async (tx) => ({
    attention: await getAttention(tx),
    recent: await listLots(tx, { page: 1, pageSize: 12, sort: "probedAt", order: "desc" }),
    trends: await getProductTrends(tx),
    excursions: (await listExcursions(tx, {})).filter((x) => x.status !== "resolved"),
  }));
  const nothing = !excursions.length && !attention.holds.length && !attention.underFloor.length && !attention.failedJobs.length;
  return (
    <>
      <PageHeader eyebrow={context.tenantName} title="Needs attention" />
      {nothing ? <EmptyState>Nothing needs attention: no open excursions, no lots on hold, none under its yield floor, no failed uploads.</EmptyState> : null}
      <div className="grid gap-4 lg:grid-cols-3">
        {excursions.length ? (
          <Panel title={`Open excursions (${excursions.length})`}>
            <ul className="space-y-1.5 text-sm">
              {excursions.slice(0, 8).map((x) => (
                <li key={x.id}>
                  <Link className="font-medium text-alert underline-offset-2 hover:underline" href={`/excursions/${x.number}`}>#{x.number}</Link> {x.title}{" "}
                  <span className="text-xs text-ink-muted">· {x.status}{x.owner ? ` · ${x.owner}` : " · no owner"}</span>
                </li>
              ))}
            </ul>
            <Link href="/excursions" className="mt-2 inline-block text-sm text-accent underline">All excursions</Link>
          </Panel>
        ) : null}
        {attention.holds.length ? (
          <Panel title={`On hold (${attention.holds.length})`}>
            <ul className="space-y-1 text-sm">{attention.holds.map((l) => <li key={l.lot}>{lotLink(l.lot)} <span className="text-ink-soft">· {l.product} · {formatPercent(l.yield)}</span></li>)}</ul>
          </Panel>
        ) : null}
        {attention.underFloor.length ? (
          <Panel title={`Under the yield floor (${attention.underFloor.length})`}>
            <ul className="space-y-1 text-sm">
              {attention.underFloor.map((l) => <li key={l.lot}>{lotLink(l.lot)} <span className="tabular text-alert">{formatPercent(l.yield)}</span> <span className="text-ink-soft">floor {formatPercent(l.yieldFloor, 0)} · {l.product}</span></li>)}
            </ul>
          </Panel>
        ) : null}
        {attention.failedJobs.length ? (
          <Panel title={`Failed uploads (${attention.failedJobs.length})`}>
            <ul className="space-y-2 text-sm">
              {attention.failedJobs.map((j) => <li key={j.id}><span className="font-medium">{j.fileName ?? "upload"}</span> <span className="text-xs text-ink-muted">{formatDateTime(j.at)}</span><p className="text-xs text-alert">{j.message}</p></li>)}
            </ul>
            <Link href="/uploads" className="mt-2 inline-block text-sm text-accent underline">All uploads</Link>
          </Panel>
        ) : null}
      </div>
      <div className="mt-8 grid gap-6 xl:grid-cols-[1fr_420px]">
        <Panel title="Recent lots">
          {recent.lots.length === 0 ? <EmptyState>No lots yet.</EmptyState> : (
            <table className="w-full text-left text-sm">
              <thead className="border-b border-slate-line text-xs uppercase tracking-wide text-ink-muted"><tr><th className="py-2 font-medium">Lot</th><th className="font-medium">Product</th><th className="font-medium">Status</th><th className="font-medium">Yield</th><th className="font-medium">Probed</th></tr></thead>
              <tbody className="divide-y divide-slate-line">
                {recent.lots.map((l) => <tr key={l.lot}><td className="py-1.5">{lotLink(l.lot)}</td><td>{l.product}</td><td>{l.status}</td><td className="tabular">{formatPercent(l.yield)}</td><td className="tabular text-ink-soft">{formatDateTime(l.probedAt)}</td></tr>)}
              </tbody>
            </table>
          )}
          <Link href="/lots" className="mt-3 inline-block text-sm text-accent underline">All lots</Link>
        </Panel>
        <Panel title="Product trends (last 30 lots)">
          {trends.length === 0 ? <EmptyState>No probed lots yet.</EmptyState> : (
            <ul className="space-y-4">
              {trends.map((t) => (
                <li key={t.product}>
                  <Link href={`/products/${encodeURIComponent(t.product)}`} className="font-medium text-accent underline-offset-2 hover:underline">{t.product}</Link>
                  <div className="mt-1 grid grid-cols-2 gap-3 text-xs text-ink-soft">
                    <div><Sparkline values={t.yields} ariaLabel={`${t.product} lot yield trend`} width={150} height={28} /><span className="tabular">yield {formatPercent(t.lastYield)}</span></div>
                    <div><Sparkline values={t.medians} ariaLabel={`${t.product} median conductance trend`} width={150} height={28} /><span className="tabular">median G {formatConductance(t.lastMedianS, t.unit)}</span></div>
                  </div>
                </li>
              ))}
            </ul>
          )}
        </Panel>
      </div>
    </>
  );
}
