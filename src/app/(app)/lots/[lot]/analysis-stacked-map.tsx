"use client";

import { useMemo, useState } from "react";
import { RateMap } from "@/components/charts/rate-map";
import { stackedFailMap } from "@/domain/yield/spatial-yield";
import { type AnalysisWafer, Caption, EmptyState, WaferPicker } from "./analysis-parts";

interface Props {
  wafers: readonly AnalysisWafer[];
  geometry: { dieWidthMm: number; dieHeightMm: number; waferDiameterMm: number; edgeExclusionMm: number };
}

/** Stacked map view: fail rate per die position over the ticked wafers (all by default), with the worst positions listed. */
export function AnalysisStackedMap({ wafers, geometry }: Props) {
  const all = useMemo(() => wafers.map((w) => w.wafer), [wafers]);
  const [chosen, setChosen] = useState<Set<number> | null>(null);
  const picked = chosen ?? new Set(all);
  const stacked = useMemo(() => wafers.filter((w) => (chosen === null || chosen.has(w.wafer)) && w.dies.length > 0), [wafers, chosen]);
  const cells = useMemo(() => stackedFailMap(stacked.map((w) => w.dies)), [stacked]);
  const worst = [...cells].filter((c) => c.fails > 0).sort((a, b) => b.failRate - a.failRate || b.tested - a.tested).slice(0, 5);
  const alwaysFail = cells.filter((c) => c.fails === c.tested).length;

  return (
    <div>
      <Caption>
        Each die position is coloured by the share of the ticked wafers on which the die there did not pass (any bin but PASS,
        NODATA included): 0 % dark blue to 100 % yellow. A position probed on only some of the wafers is rated over those it
        was probed on. A ring or a cluster that repeats from wafer to wafer points at a tool or a process step rather than at
        random defects.
      </Caption>
      <WaferPicker label="Stack wafers" wafers={all} chosen={picked} onChange={setChosen} />
      {stacked.length === 0 ? (
        <EmptyState>Tick at least one probed wafer to stack.</EmptyState>
      ) : (
        <div className="flex flex-wrap gap-4">
          <div className="w-full max-w-[640px]">
            <RateMap cells={cells} geometry={geometry} ariaLabel={`Stacked fail map over ${stacked.length} wafers`} />
          </div>
          <div className="min-w-[16rem] flex-1 text-sm">
            <p className="tabular">
              {stacked.length} wafer{stacked.length === 1 ? "" : "s"} stacked · {cells.length} die positions · {alwaysFail} fail on every stacked wafer
            </p>
            <h3 className="mt-3 font-semibold">Worst positions</h3>
            {worst.length === 0 ? (
              <p className="text-ink-soft">No die failed on the stacked wafers.</p>
            ) : (
              <ul className="tabular mt-1 space-y-0.5">
                {worst.map((c) => (
                  <li key={`${c.x},${c.y}`}>
                    ({c.x}, {c.y}): {(100 * c.failRate).toFixed(1)} % ({c.fails} of {c.tested} wafers)
                  </li>
                ))}
              </ul>
            )}
          </div>
        </div>
      )}
    </div>
  );
}
