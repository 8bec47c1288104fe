import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { PageHeader, Panel } from "@/components/ui/page-header";
import { can } from "@/lib/permissions";
import { listDispositions } from "@/server/db/queries/dispositions";
import { getLotJudgement } from "@/server/spc/lot-judgement";
import { DispositionPanel } from "./disposition-panel";
import { JudgementPanel } from "./judgement-panel";
import { formatConductance, formatDateTime, formatPercent, formatTemperature } from "@/lib/format";
import { requireContext } from "@/server/auth/context";
import { getLotDetail } from "@/server/db/queries/lots";
import { findProduct } from "@/server/db/queries/products";
import { withScope } from "@/server/db/scope";
import { AppError } from "@/server/http/errors";
import { listViews } from "@/server/db/queries/views";
import { LotExplorer } from "./lot-explorer";
import { SavedViews } from "./saved-views";
import { REFERENCE_CHUCK_K, TemperatureNote } from "./temperature-note";

export async function generateMetadata({ params }: { params: Promise<{ lot: string }> }): Promise<Metadata> {
  return { title: `Lot ${decodeURIComponent((await params).lot)}` };
}

export default async function LotPage({ params }: { params: Promise<{ lot: string }> }) {
  const lotNumber = decodeURIComponent((await params).lot);
  const context = await requireContext("data.read");
  const loaded = await withScope(context.scope, async (tx) => {
    try {
      const lot = await getLotDetail(tx, lotNumber);
      return {
        lot,
        product: await findProduct(tx, lot.product),
        views: await listViews(tx, `/lots/${encodeURIComponent(lotNumber)}`),
        judgement: await getLotJudgement(tx, lot.id),
        history: await listDispositions(tx, lot.id),
      };
    } catch (error) {
      if (error instanceof AppError && error.code === "not_found") return null;
      throw error;
    }
  });
  if (!loaded?.product) notFound();
  const { lot, product, views, judgement, history } = loaded;
  const facts: [string, string][] = [
    ["Status", lot.status],
    ["Yield", `${formatPercent(lot.yield)} (${lot.pass}/${lot.tested})`],
    ["Median G", formatConductance(lot.medianConductanceS, product.displayUnit)],
    ["Out of window", String(lot.outOfWindow)],
    ["Chuck", formatTemperature(lot.chuckTemperatureK)],
    ["Station", lot.station ?? "—"],
    ["Probed", formatDateTime(lot.probedAt)],
  ];
  // Process control and disposition sit beside the wafer map on wide screens (below it on narrow ones), so the
  // map opens in the first screen: it is what the page is for.
  const panels = (
    <>
      <JudgementPanel judgement={judgement} openExcursions={lot.openExcursions} />
      <Panel title="Disposition">
        <DispositionPanel lot={lot.lot} status={lot.status} releasedAt={lot.releasedAt} openExcursions={lot.openExcursions} history={history} canDispose={can(context.role, "lots.disposition")} />
      </Panel>
    </>
  );
  return (
    <>
      <PageHeader eyebrow={`Lot · ${lot.customer ?? "internal"}`} title={lot.lot}>
        <Link className="text-sm text-accent underline" href={`/products/${encodeURIComponent(lot.product)}`}>{lot.product}</Link>
        <Link className="text-sm text-accent underline" href={`/lots/${encodeURIComponent(lot.lot)}/report`}>Lot report</Link>
        <Suspense fallback={null}>
          <SavedViews views={views} />
        </Suspense>
      </PageHeader>
      <dl className="mb-5 grid grid-cols-2 gap-3 md:grid-cols-4 xl:grid-cols-7">
        {facts.map(([label, value]) => (
          <div key={label} className="rounded border border-slate-line bg-slate-panel px-3 py-2">
            <dt className="text-xs uppercase tracking-wide text-ink-muted">{label}</dt>
            <dd className="tabular mt-0.5 text-sm font-medium">{value}</dd>
          </div>
        ))}
      </dl>
      <TemperatureNote lotK={lot.chuckTemperatureK} referenceK={REFERENCE_CHUCK_K} model={product.deviceModel} unit={product.displayUnit} />
      {lot.wafers.length === 0 ? (
        <>
          <p className="mb-5 text-sm text-ink-soft">No wafers have been probed for this lot yet.</p>
          <div className="grid gap-4 xl:grid-cols-2">{panels}</div>
        </>
      ) : (
        <Suspense fallback={<p className="text-sm text-ink-muted">Loading the wafers…</p>}>
          <LotExplorer lot={lot.lot} wafers={lot.wafers} geometry={{ dieWidthMm: product.dieWidthMm, dieHeightMm: product.dieHeightMm, waferDiameterMm: product.waferDiameterMm, edgeExclusionMm: product.edgeExclusionMm }} unit={product.displayUnit} spec={{ lowS: product.specLowS, highS: product.specHighS }} canInk={can(context.role, "dies.ink") && lot.status !== "released" && lot.status !== "scrapped"} aside={panels} />
        </Suspense>
      )}
    </>
  );
}
