"use client";

import { useMemo, useState } from "react";
import { HistogramChart } from "@/components/charts/histogram-chart";
import { SERIES_COLOURS } from "@/components/charts/chart-theme";
import { PARAMETRIC_BINS, spreadOf, waferDistributions, type Spread } from "@/domain/yield/lot-analysis";
import { conductanceIn, type ConductanceUnit, UNIT_LABEL } from "@/lib/format";
import { type AnalysisWafer, Caption, EmptyState, formatInUnit, TABLE, TD, TD_NUM, TH, WaferPicker } from "./analysis-parts";

interface Props {
  wafers: readonly AnalysisWafer[];
  unit: ConductanceUnit;
}

function SpreadRow({ label, spread, unit, strong }: { label: string; spread: Spread; unit: ConductanceUnit; strong?: boolean }) {
  return (
    <tr className={strong ? "font-semibold" : undefined}>
      <td className={TD}>{label}</td>
      <td className={TD_NUM}>{spread.n}</td>
      <td className={TD_NUM}>{formatInUnit(spread.median, unit)}</td>
      <td className={TD_NUM}>{formatInUnit(spread.q1, unit)}</td>
      <td className={TD_NUM}>{formatInUnit(spread.q3, unit)}</td>
      <td className={TD_NUM}>{formatInUnit(spread.iqr, unit)}</td>
    </tr>
  );
}

/** Wafer comparison view: conductance histograms of the parametric dies on shared edges, overlaid per ticked wafer, and median/IQR per wafer. */
export function AnalysisComparison({ wafers, unit }: Props) {
  const values = useMemo(
    () =>
      wafers.map((w) => ({
        wafer: w.wafer,
        values: w.dies.flatMap((d) => (PARAMETRIC_BINS.includes(d.bin) && d.conductanceS !== null && Number.isFinite(d.conductanceS) ? [conductanceIn(d.conductanceS, unit)] : [])),
      })),
    [wafers, unit],
  );
  const distributions = useMemo(() => waferDistributions(values), [values]);
  const lotSpread = useMemo(() => spreadOf(values.flatMap((v) => v.values)), [values]);
  const all = useMemo(() => wafers.map((w) => w.wafer), [wafers]);
  // One Okabe–Ito colour per wafer at first, so no two overlaid outlines share a colour.
  const [chosen, setChosen] = useState<Set<number>>(() => new Set(all.slice(0, SERIES_COLOURS.length)));
  const series = useMemo(
    () => distributions.wafers.filter((w) => chosen.has(w.wafer) && w.spread.n > 0).map((w) => ({ name: `Wafer ${w.wafer}`, counts: w.counts })),
    [distributions, chosen],
  );
  const beyond = distributions.wafers.reduce((sum, w) => sum + w.below + w.above, 0);
  const binWidth = distributions.edges.length > 1 ? distributions.edges[1]! - distributions.edges[0]! : null;
  const title = unit === "G0" ? "G/G₀" : `G (${UNIT_LABEL[unit]})`;

  if (lotSpread.n === 0) return <EmptyState>No die of this lot has a parametric conductance to compare.</EmptyState>;
  return (
    <div>
      <Caption>
        Conductance of the parametric dies (PASS, LOW, HIGH and NONLINEAR; shorts, opens and NODATA left out) in {UNIT_LABEL[unit]},
        binned on the same {distributions.edges.length - 1} equal bins of {formatInUnit(binWidth, unit)} for every wafer (bin count by the
        Freedman–Diaconis rule, range cut at Q₁ − 3·IQR and Q₃ + 3·IQR of the lot{beyond > 0 ? `, which leaves ${beyond} far-out dies off the chart` : ""}).
        Median and quartiles use every parametric die (type 7, linear interpolation); IQR = Q₃ − Q₁. A wafer whose outline sits
        apart from the others, or is wider, was processed differently.
      </Caption>
      <WaferPicker label="Overlay wafers" wafers={all} chosen={chosen} onChange={setChosen} />
      {series.length === 0 ? (
        <EmptyState>Tick a wafer with parametric dies to draw its histogram.</EmptyState>
      ) : (
        <HistogramChart edges={distributions.edges} series={series} valueTitle={title} ariaLabel={`Conductance histograms of ${series.length} wafers`} height={320} />
      )}
      <table className={`${TABLE} mt-3`} aria-label="Conductance median and IQR per wafer">
        <thead>
          <tr>
            <th className={TH}>Wafer</th>
            <th className={`${TH} text-right`}>Dies</th>
            <th className={`${TH} text-right`}>Median</th>
            <th className={`${TH} text-right`}>Q₁</th>
            <th className={`${TH} text-right`}>Q₃</th>
            <th className={`${TH} text-right`}>IQR</th>
          </tr>
        </thead>
        <tbody>
          {distributions.wafers.map((w) => (
            <SpreadRow key={w.wafer} label={`W${w.wafer}`} spread={w.spread} unit={unit} />
          ))}
          <SpreadRow label="Lot" spread={lotSpread} unit={unit} strong />
        </tbody>
      </table>
    </div>
  );
}
