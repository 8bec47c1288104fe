"use client";

import { useMemo } from "react";
import { DEFAULT_CLUSTER_ALPHA, dieAreaCm2, fitDefectDensity } from "@/domain/yield/defect-density";
import type { WaferGeometry } from "@/domain/yield/geometry";
import { grossDieCheck } from "@/domain/yield/lot-analysis";
import { waferYield } from "@/domain/yield/yield";
import { formatPercent } from "@/lib/format";
import { type AnalysisWafer, Caption, EmptyState, TABLE, TD, TD_NUM, TH } from "./analysis-parts";

function perCm2(d0: number): string {
  if (d0 === Number.POSITIVE_INFINITY) return "∞ (no die passed)";
  return `${d0.toPrecision(3)} cm⁻²`;
}

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded border border-slate-line px-3 py-2">
      <dt className="text-xs text-ink-muted">{label}</dt>
      <dd className="tabular mt-0.5 text-sm font-medium">{value}</dd>
    </div>
  );
}

/** Defect density view: D₀ of the Poisson, Murphy and negative-binomial models from the wafer yields, and the gross-dies check against the probed dies. */
export function AnalysisDefectDensity({ wafers, geometry }: { wafers: readonly AnalysisWafer[]; geometry: WaferGeometry }) {
  const areaCm2 = dieAreaCm2(geometry.dieWidthMm, geometry.dieHeightMm);
  const rows = useMemo(
    () =>
      wafers
        .filter((w) => w.dies.length > 0)
        .map((w) => ({ wafer: w.wafer, ...waferYield(w.dies.map((d) => d.bin)), outside: w.dies.filter((d) => d.zone === "outside").length })),
    [wafers],
  );
  const fit = useMemo(() => {
    const yields = rows.flatMap((r) => (r.yield === null ? [] : [r.yield]));
    return yields.length ? fitDefectDensity(yields, areaCm2, DEFAULT_CLUSTER_ALPHA) : null;
  }, [rows, areaCm2]);
  const gross = useMemo(() => grossDieCheck(geometry), [geometry]);
  const usableDiameterMm = 2 * geometry.usableRadiusMm;

  if (!fit) return <EmptyState>No probed wafer has a yield to fit.</EmptyState>;
  return (
    <div>
      <Caption>
        Defect density D₀ is the number of killer defects per cm² that would give the lot&apos;s mean wafer yield Y on a die of
        area A = {areaCm2.toPrecision(3)} cm² ({geometry.dieWidthMm} mm × {geometry.dieHeightMm} mm), under three yield models:
        Poisson Y = e^(−AD₀) for defects scattered at random, Murphy Y = ((1 − e^(−AD₀))/AD₀)², and negative binomial
        Y = (1 + AD₀/α)^(−α) with cluster parameter α = {fit.alpha} (a commonly used value) for clustered defects. Every fail
        counts as a defect here, so edge rings, shorts clusters or a parametric shift inflate D₀.
      </Caption>
      <dl className="mb-4 grid grid-cols-2 gap-3 md:grid-cols-3 xl:grid-cols-5" aria-label="Defect density">
        <Fact label="Die area A" value={`${areaCm2.toPrecision(3)} cm²`} />
        <Fact label={`Mean yield (${fit.wafers} wafers)`} value={formatPercent(fit.meanYield, 2)} />
        <Fact label="D₀ Poisson" value={perCm2(fit.poissonD0PerCm2)} />
        <Fact label="D₀ Murphy" value={perCm2(fit.murphyD0PerCm2)} />
        <Fact label="D₀ negative binomial" value={`${perCm2(fit.negativeBinomialD0PerCm2)} (α = ${fit.alpha})`} />
      </dl>
      <h3 className="font-semibold">Gross dies per wafer</h3>
      <p className="mb-2 max-w-3xl text-sm text-ink-soft">
        The estimate N = πd²/4A − πd/√(2A) (common practice), with d the usable diameter {usableDiameterMm.toFixed(1)} mm (wafer{" "}
        {geometry.waferDiameterMm} mm less {geometry.edgeExclusionMm} mm edge exclusion each side), against the exact number of whole
        dies that fit inside that circle, and the dies the probe station actually reported on each wafer.
      </p>
      <dl className="mb-4 grid grid-cols-2 gap-3 md:grid-cols-3" aria-label="Gross dies per wafer">
        <Fact label={`Formula, d = ${usableDiameterMm.toFixed(1)} mm`} value={`${gross.estimateUsable.toFixed(1)} dies`} />
        <Fact label="Exact count inside usable circle" value={`${gross.exactInside} dies`} />
        <Fact label={`Formula, whole wafer d = ${geometry.waferDiameterMm} mm`} value={`${gross.estimateWhole.toFixed(1)} dies`} />
      </dl>
      <table className={TABLE} aria-label="Wafer yields used and dies probed">
        <thead>
          <tr>
            <th className={TH}>Wafer</th>
            <th className={`${TH} text-right`}>Dies probed</th>
            <th className={`${TH} text-right`}>Probed vs exact count</th>
            <th className={`${TH} text-right`}>Outside usable circle</th>
            <th className={`${TH} text-right`}>PASS</th>
            <th className={`${TH} text-right`}>Yield used</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.wafer}>
              <td className={TD}>W{r.wafer}</td>
              <td className={TD_NUM}>{r.tested}</td>
              <td className={TD_NUM}>{r.tested - gross.exactInside > 0 ? "+" : ""}{r.tested - gross.exactInside} dies</td>
              <td className={TD_NUM}>{r.outside}</td>
              <td className={TD_NUM}>{r.pass}</td>
              <td className={TD_NUM}>{formatPercent(r.yield, 2)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
