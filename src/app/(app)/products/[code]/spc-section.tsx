import type { ReactNode } from "react";
import { ControlChart } from "@/components/charts/control-chart";
import { EmptyState, Panel } from "@/components/ui/page-header";
import { formatConductance, formatDateTime } from "@/lib/format";
import { can } from "@/lib/permissions";
import { requireContext } from "@/server/auth/context";
import { listLimitSets } from "@/server/db/queries/limit-sets";
import { getProduct } from "@/server/db/queries/products";
import { listWatchers } from "@/server/db/queries/watchers";
import { withScope } from "@/server/db/scope";
import { getProductCharts } from "@/server/spc/product-charts";
import { FreezeLimitsForm } from "./_spc/freeze-limits-form";
import { WatchButton } from "./_spc/watch-button";

const ChartTitle = ({ children }: { children: ReactNode }) => <h3 className="-mb-3 text-sm font-semibold text-ink-soft">{children}</h3>;
const fixed = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? "—" : v.toFixed(2));

/** The product page's SPC part (§6, §13): charts under the limits in force, capability, versions, freezing, watch list. */
export async function SpcSection({ productCode }: { productCode: string }) {
  const context = await requireContext("data.read");
  const data = await withScope(context.scope, async (tx) => {
    const product = await getProduct(tx, productCode);
    const recent = await tx.selectFrom("lots").select("lot_number").where("product_id", "=", product.id).orderBy("probed_at", "desc").limit(20).execute();
    return {
      product,
      versions: await listLimitSets(tx, product.id),
      charts: await getProductCharts(tx, product),
      watchers: await listWatchers(tx, product.id),
      recentLots: recent.map((r) => r.lot_number).reverse(),
    };
  });
  const { product, versions, charts, watchers } = data;
  const inForce = versions[0];
  const canFreeze = can(context.role, "limits.freeze");
  const watching = watchers.some((w) => w.userId === context.user?.id);
  const cap = charts?.capability;
  // Conductances in the product's own unit, as its charts and the rest of the product show them.
  const g = (valueS: number | null | undefined) => formatConductance(valueS, product.displayUnit);
  return (
    <div className="space-y-6">
      <Panel title={charts ? `Control charts · limits version ${charts.version}` : "Control charts"}>
        {charts ? (
          <div className="space-y-5">
            <p className="text-xs text-ink-muted">
              {charts.lotCount} lots probed since version {charts.version} was frozen ({formatDateTime(inForce?.frozenAt)}), judged with {product.rules === "nelson" ? "Nelson rules 1–8" : "Western Electric rules 1–4"}. {charts.notes.join(" ")}
            </p>
            <ChartTitle>Individuals · wafer median G ({charts.conductanceUnit})</ChartTitle>
            <ControlChart {...charts.medianG} ariaLabel="Individuals chart of wafer median G" height={300} />
            <ChartTitle>Moving range of wafer median G ({charts.conductanceUnit}), σ̂ = MR̄/d₂</ChartTitle>
            <ControlChart {...charts.movingRange} ariaLabel="Moving range of wafer median G" height={200} />
            {charts.lotMeanG ? <><ChartTitle>Lot X̄ · mean of wafer median G ({charts.conductanceUnit}), wafers as the subgroup</ChartTitle><ControlChart {...charts.lotMeanG} ariaLabel="Lot X̄ chart of wafer median G" height={240} /></> : null}
            <ChartTitle>Wafer yield (%) against the yield floor</ChartTitle>
            <ControlChart {...charts.yieldChart} ariaLabel="Wafer yield against the yield floor" height={240} />
          </div>
        ) : (
          <EmptyState>No limits are frozen for {product.code} yet: choose a baseline below, review it and freeze it.</EmptyState>
        )}
      </Panel>
      <Panel title="Capability against the spec window">
        {cap?.capability ? (
          <>
            <table className="text-sm tabular-nums">
              <tbody>
                <tr><th className="pr-4 text-left font-normal text-ink-muted">Cp</th><td className="pr-8">{fixed(cap.capability.cp)}</td><th className="pr-4 text-left font-normal text-ink-muted">Pp</th><td>{fixed(cap.capability.pp)}</td></tr>
                <tr><th className="pr-4 text-left font-normal text-ink-muted">Cpk</th><td className="pr-8">{fixed(cap.capability.cpk)}</td><th className="pr-4 text-left font-normal text-ink-muted">Ppk</th><td>{fixed(cap.capability.ppk)}</td></tr>
                <tr><th className="pr-4 text-left font-normal text-ink-muted">σ within</th><td className="pr-8">{g(cap.capability.withinSigmaS)}</td><th className="pr-4 text-left font-normal text-ink-muted">σ overall</th><td>{g(cap.capability.overallSigmaS)}</td></tr>
              </tbody>
            </table>
            <p className="mt-2 text-xs text-ink-muted">{cap.capability.sigmaNote} Spec {g(product.specLowS)} to {g(product.specHighS)}, mean {g(cap.capability.meanS)}.</p>
          </>
        ) : (
          <EmptyState>No capability yet: {cap?.reason ?? "no limits are frozen"}.</EmptyState>
        )}
      </Panel>
      <Panel title="Limit versions">
        {versions.length === 0 ? <EmptyState>No versions yet.</EmptyState> : (
          <table className="w-full text-sm tabular-nums">
            <thead className="text-left text-xs text-ink-muted">
              <tr><th className="py-1">Version</th><th>Frozen</th><th>By</th><th>Baseline</th><th>Centre G</th><th>σ̂</th><th>UCL / LCL</th><th>Die window</th></tr>
            </thead>
            <tbody className="divide-y divide-slate-line">
              {versions.map((v, i) => {
                const limits = v.limits.waferMedianConductanceS.individuals;
                return (
                  <tr key={v.version} className="align-top">
                    <td className="py-2 font-medium">{v.version}{i === 0 ? <span className="ml-1 text-xs font-normal text-bin-pass">in force</span> : null}</td>
                    <td>{formatDateTime(v.frozenAt)}</td>
                    <td>{v.frozenBy}</td>
                    <td title={v.lots.join(", ")}>{v.baseline.kind === "dates" ? `${v.baseline.from?.slice(0, 10)} – ${v.baseline.to?.slice(0, 10)}` : "chosen lots"} · {v.lotCount} lots, {v.waferCount} wafers</td>
                    <td>{g(limits.center)}</td>
                    <td>{g(limits.sigma)}</td>
                    <td>{g(limits.ucl)} / {g(limits.lcl)}</td>
                    <td>{v.dieWindow ? `${g(v.dieWindow.lowS)} – ${g(v.dieWindow.highS)}` : "—"}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
      </Panel>
      {canFreeze ? (
        <Panel title="Freeze new limits">
          <FreezeLimitsForm productCode={product.code} recentLots={data.recentLots} />
        </Panel>
      ) : null}
      <Panel title="Watch list">
        <p className="mb-2 text-sm">
          {watchers.length ? watchers.map((w) => w.name).join(", ") : "Nobody yet: new excursions e-mail every engineer and admin of the tenant until someone watches this product."}
        </p>
        {can(context.role, "products.edit") ? <WatchButton productCode={product.code} watching={watching} /> : null}
      </Panel>
    </div>
  );
}
