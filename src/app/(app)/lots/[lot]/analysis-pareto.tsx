"use client";

import { useMemo } from "react";
import { BinParetoChart } from "@/components/charts/bin-pareto-chart";
import { binPareto } from "@/domain/yield/yield";
import { type AnalysisDie, type AnalysisWafer, Caption, EmptyState, TABLE, TD, TD_NUM, TH } from "./analysis-parts";

function ParetoBlock({ title, dies }: { title: string; dies: readonly AnalysisDie[] }) {
  const entries = useMemo(() => binPareto(dies.map((d) => d.bin)), [dies]);
  const fails = entries.reduce((sum, e) => sum + e.count, 0);
  return (
    <section aria-label={`Bin Pareto of ${title}`}>
      <h3 className="font-semibold">{title}</h3>
      <p className="tabular mb-2 text-sm text-ink-soft">
        {fails} of {dies.length} tested dies failed ({dies.length ? ((100 * fails) / dies.length).toFixed(1) : "—"} %)
      </p>
      {dies.length === 0 ? (
        <EmptyState>No dies were tested.</EmptyState>
      ) : entries.length === 0 ? (
        <EmptyState>No failing dies: every tested die is PASS.</EmptyState>
      ) : (
        <>
          <BinParetoChart entries={entries} ariaLabel={`Bin Pareto of ${title}`} height={260} />
          <table className={`${TABLE} mt-2`} aria-label={`Failing bins of ${title}`}>
            <thead>
              <tr>
                <th className={TH}>Bin</th>
                <th className={`${TH} text-right`}>Dies</th>
                <th className={`${TH} text-right`}>Share of fails</th>
                <th className={`${TH} text-right`}>Cumulative</th>
              </tr>
            </thead>
            <tbody>
              {entries.map((e) => (
                <tr key={e.bin}>
                  <td className={TD}>{e.bin}</td>
                  <td className={TD_NUM}>{e.count}</td>
                  <td className={TD_NUM}>{e.percentOfFails.toFixed(1)} %</td>
                  <td className={TD_NUM}>{e.cumulativePercent.toFixed(1)} %</td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      )}
    </section>
  );
}

/** Bin Pareto view: failing bins by count, largest first, with the cumulative share, for the lot and for the selected wafer. */
export function AnalysisPareto({ wafers, selectedWafer }: { wafers: readonly AnalysisWafer[]; selectedWafer: number }) {
  const lotDies = useMemo(() => wafers.flatMap((w) => w.dies), [wafers]);
  const waferDies = wafers.find((w) => w.wafer === selectedWafer)?.dies ?? [];
  return (
    <div>
      <Caption>
        Every die that did not pass, counted by the first bin it matched (NODATA, SHORT, OPEN, NONLINEAR, LOW, HIGH), sorted
        by count; the line is the running share of all fails. The few bins at the left are where most of the yield went.
      </Caption>
      <div className="grid gap-6 xl:grid-cols-2">
        <ParetoBlock title="the lot" dies={lotDies} />
        <ParetoBlock title={`wafer ${selectedWafer}`} dies={waferDies} />
      </div>
    </div>
  );
}
