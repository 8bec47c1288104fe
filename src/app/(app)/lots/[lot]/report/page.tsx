import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { formatConductance, formatDate, formatDateTime, formatPercent, formatTemperature } from "@/lib/format";
import { requireContext } from "@/server/auth/context";
import { withScope } from "@/server/db/scope";
import { AppError } from "@/server/http/errors";
import { buildLotReport } from "@/server/reports/lot-report";
import { REPORT_CAUTIONS } from "@/lib/cautions";
import { ReportMaps } from "./report-maps";

export async function generateMetadata({ params }: { params: Promise<{ lot: string }> }): Promise<Metadata> {
  return { title: `Lot report ${decodeURIComponent((await params).lot)}` };
}

export default async function LotReportPage({ params }: { params: Promise<{ lot: string }> }) {
  const lotNumber = decodeURIComponent((await params).lot);
  const context = await requireContext("reports.read");
  const report = await withScope(context.scope, (tx) => buildLotReport(tx, lotNumber)).catch((error) => {
    if (error instanceof AppError && error.code === "not_found") return null;
    throw error;
  });
  if (!report) notFound();
  const unit = report.product.displayUnit;
  const th = "py-1.5 pr-4 text-left text-xs font-medium uppercase tracking-wide text-ink-muted";
  return (
    <article className="mx-auto max-w-5xl rounded-lg border border-slate-line bg-slate-panel p-8 print:border-0 print:p-0">
      <header className="flex flex-wrap items-start justify-between gap-4 border-b border-slate-line pb-4">
        <div>
          <p className="text-xs font-semibold uppercase tracking-[0.18em] text-ink-muted">{context.tenantName} · lot report</p>
          <h1 className="mt-1 text-2xl font-semibold">Lot {report.lot}</h1>
          <p className="mt-1 text-sm text-ink-soft">{report.product.code} — {report.product.name}{report.customer ? ` · for ${report.customer}` : ""}</p>
        </div>
        <div className="text-right text-sm">
          <p><span className="text-ink-muted">Disposition</span> <span className="font-medium">{report.status}</span>{report.releasedAt ? ` on ${formatDate(report.releasedAt)}` : ""}</p>
          <p className="text-ink-muted">Probed {formatDateTime(report.probedAt)} at {formatTemperature(report.chuckTemperatureK)}</p>
          <a className="mt-2 inline-block rounded bg-accent px-3 py-1.5 text-sm font-medium text-white hover:bg-accent-strong print:hidden" href={`/api/v1/lots/${encodeURIComponent(report.lot)}/report?format=pdf`}>Download PDF</a>
        </div>
      </header>
      <section className="mt-6 grid grid-cols-2 gap-3 md:grid-cols-4" aria-label="Summary">
        {[
          ["Yield", `${formatPercent(report.yield)} (${report.pass}/${report.tested})`],
          ["Shipped yield", `${formatPercent(report.shippedYield)} (${report.shippedPass}/${report.tested})`],
          ["Median G", formatConductance(report.medianConductanceS, unit)],
          ["Within spec", `${formatPercent(report.withinSpecFraction)} of measured dies`],
        ].map(([k, v]) => (
          <div key={k} className="rounded border border-slate-line px-3 py-2">
            <p className="text-xs uppercase tracking-wide text-ink-muted">{k}</p>
            <p className="tabular mt-0.5 font-medium">{v}</p>
          </div>
        ))}
      </section>
      <p className="mt-3 text-sm text-ink-soft">Spec window {formatConductance(report.product.specLowS, unit)} – {formatConductance(report.product.specHighS, unit)}; die {report.product.dieWidthMm} × {report.product.dieHeightMm} mm on {report.product.waferDiameterMm} mm wafers.</p>
      <section className="mt-6" aria-label="Yield per wafer">
        <h2 className="mb-2 text-base font-semibold">Yield per wafer</h2>
        <table className="tabular w-full text-sm">
          <thead className="border-b border-slate-line"><tr><th className={th}>Wafer</th><th className={th}>Tested</th><th className={th}>Pass</th><th className={th}>Yield</th><th className={th}>Inked</th><th className={th}>Shipped yield</th><th className={th}>Median G</th></tr></thead>
          <tbody className="divide-y divide-slate-line">
            {report.wafers.map((w) => <tr key={w.wafer}><td className="py-1">{w.wafer}</td><td>{w.tested}</td><td>{w.pass}</td><td>{formatPercent(w.yield)}</td><td>{w.inked}</td><td>{formatPercent(w.shippedYield)}</td><td>{formatConductance(w.medianConductanceS, unit)}</td></tr>)}
          </tbody>
        </table>
      </section>
      <section className="mt-6" aria-label="Bins">
        <h2 className="mb-2 text-base font-semibold">Bins</h2>
        <table className="tabular w-full max-w-md text-sm">
          <thead className="border-b border-slate-line"><tr><th className={th}>Bin</th><th className={th}>Dies</th><th className={th}>Share</th></tr></thead>
          <tbody className="divide-y divide-slate-line">{report.bins.map((b) => <tr key={b.bin}><td className="py-1">{b.bin}</td><td>{b.count}</td><td>{formatPercent(b.fraction)}</td></tr>)}</tbody>
        </table>
      </section>
      <section className="mt-6" aria-label="Bin wafer maps">
        <h2 className="mb-2 text-base font-semibold">Bin wafer maps</h2>
        <ReportMaps wafers={report.maps} geometry={report.product} />
      </section>
      <footer className="mt-8 border-t border-slate-line pt-4 text-xs text-ink-muted">
        {REPORT_CAUTIONS.map((c) => <p key={c} className="mt-1">{c}</p>)}
        <p className="mt-2">Generated {formatDateTime(new Date())} by Lotwarden for {context.tenantName}.</p>
      </footer>
    </article>
  );
}
