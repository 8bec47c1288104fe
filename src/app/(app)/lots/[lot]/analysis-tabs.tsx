"use client";

import { useSearchParams } from "next/navigation";
import { type KeyboardEvent, useId, useMemo, useRef } from "react";
import { assignZones, waferGeometry } from "@/domain/yield/geometry";
import { parseBin } from "@/domain/yield/lot-analysis";
import type { Bin } from "@/domain/yield/yield";
import type { ConductanceUnit } from "@/lib/format";
import type { DieRecord, WaferSummary } from "@/lib/schemas/lots";
import { AnalysisComparison } from "./analysis-comparison";
import { AnalysisDefectDensity } from "./analysis-defect-density";
import { AnalysisPareto } from "./analysis-pareto";
import type { AnalysisDie, AnalysisWafer } from "./analysis-parts";
import { AnalysisStackedMap } from "./analysis-stacked-map";
import { AnalysisZones } from "./analysis-zones";

interface Props {
  lot: string;
  wafers: WaferSummary[];
  /** Every die of the lot, with at least these fields. */
  dies: Pick<DieRecord, "wafer" | "x" | "y" | "bin" | "conductanceS">[];
  geometry: { dieWidthMm: number; dieHeightMm: number; waferDiameterMm: number; edgeExclusionMm: number };
  unit: ConductanceUnit;
}

const TABS = [
  { id: "stacked", label: "Stacked map" },
  { id: "zones", label: "Radial zones" },
  { id: "pareto", label: "Bin Pareto" },
  { id: "comparison", label: "Wafer comparison" },
  { id: "defects", label: "Defect density" },
] as const;
type TabId = (typeof TABS)[number]["id"];

/** The lot's dies grouped by wafer (every wafer of the strip, in its order), bins parsed and radial zones assigned per wafer. */
function groupByWafer(wafers: readonly WaferSummary[], dies: Props["dies"], geometry: Props["geometry"]): AnalysisWafer[] {
  const g = waferGeometry(geometry);
  const byWafer = new Map<number, { x: number; y: number; bin: Bin; conductanceS: number | null }[]>();
  for (const d of dies) {
    const bin = parseBin(d.bin);
    if (bin === null) continue;
    const list = byWafer.get(d.wafer) ?? [];
    list.push({ x: d.x, y: d.y, bin, conductanceS: d.conductanceS });
    byWafer.set(d.wafer, list);
  }
  return wafers.map((w) => ({ wafer: w.wafer, dies: assignZones(byWafer.get(w.wafer) ?? [], g).map((d): AnalysisDie => ({ x: d.x, y: d.y, bin: d.bin, conductanceS: d.conductanceS, zone: d.zone })) }));
}

/**
 * The lot page's analysis tabs (§7): stacked fail map, radial zones, bin Pareto, wafer comparison and defect
 * density, over the dies the explorer has loaded. Tabs follow the WAI-ARIA tabs pattern (arrow keys, Home, End;
 * automatic activation); the open tab is kept in the URL as `analysis` without a server round trip.
 */
export function AnalysisTabs({ lot, wafers, dies, geometry, unit }: Props) {
  const params = useSearchParams();
  const requested = params.get("analysis");
  const active: TabId = TABS.some((t) => t.id === requested) ? (requested as TabId) : "stacked";
  const selectedWafer = Number(params.get("wafer") ?? wafers[0]?.wafer ?? 1);
  const baseId = useId();
  const tabRefs = useRef<Partial<Record<TabId, HTMLButtonElement | null>>>({});
  const checked = useMemo(() => waferGeometry(geometry), [geometry]);
  const grouped = useMemo(() => groupByWafer(wafers, dies, geometry), [wafers, dies, geometry]);

  const open = (id: TabId, focus: boolean) => {
    const next = new URLSearchParams(window.location.search);
    if (id === "stacked") next.delete("analysis");
    else next.set("analysis", id);
    const query = next.toString();
    // Next.js syncs useSearchParams with history.replaceState, so switching tabs re-renders without refetching the
    // page; the state must be null, since Next skips the sync for a state object carrying its own markers.
    window.history.replaceState(null, "", `${window.location.pathname}${query ? `?${query}` : ""}`);
    if (focus) tabRefs.current[id]?.focus();
  };

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    const index = TABS.findIndex((t) => t.id === active);
    const target =
      event.key === "ArrowRight" ? (index + 1) % TABS.length
      : event.key === "ArrowLeft" ? (index - 1 + TABS.length) % TABS.length
      : event.key === "Home" ? 0
      : event.key === "End" ? TABS.length - 1
      : null;
    if (target === null) return;
    event.preventDefault();
    open(TABS[target]!.id, true);
  };

  const probed = dies.length > 0;
  return (
    <section aria-label={`Analysis of lot ${lot}`} className="rounded-lg border border-slate-line bg-slate-panel p-4">
      <h2 className="mb-2 text-lg font-semibold">Analysis</h2>
      <div role="tablist" aria-label="Analysis views" className="mb-4 flex flex-wrap gap-1 border-b border-slate-line" onKeyDown={onKeyDown}>
        {TABS.map((t) => (
          <button
            key={t.id}
            ref={(el) => {
              tabRefs.current[t.id] = el;
            }}
            type="button"
            role="tab"
            id={`${baseId}-tab-${t.id}`}
            aria-selected={t.id === active}
            aria-controls={t.id === active ? `${baseId}-panel` : undefined}
            tabIndex={t.id === active ? 0 : -1}
            onClick={() => open(t.id, false)}
            className={`-mb-px rounded-t border-b-2 px-3 py-2 text-sm font-medium focus:outline-none focus-visible:ring-2 focus-visible:ring-accent/50 ${t.id === active ? "border-accent text-accent" : "border-transparent text-ink-soft hover:text-ink"}`}
          >
            {t.label}
          </button>
        ))}
      </div>
      <div role="tabpanel" id={`${baseId}-panel`} aria-labelledby={`${baseId}-tab-${active}`} tabIndex={0} className="focus:outline-none focus-visible:ring-2 focus-visible:ring-accent/50">
        {!probed ? (
          <p className="text-sm text-ink-muted">No dies loaded for this lot yet.</p>
        ) : active === "stacked" ? (
          <AnalysisStackedMap wafers={grouped} geometry={geometry} />
        ) : active === "zones" ? (
          <AnalysisZones wafers={grouped} geometry={checked} />
        ) : active === "pareto" ? (
          <AnalysisPareto wafers={grouped} selectedWafer={selectedWafer} />
        ) : active === "comparison" ? (
          <AnalysisComparison wafers={grouped} unit={unit} />
        ) : (
          <AnalysisDefectDensity wafers={grouped} geometry={checked} />
        )}
      </div>
    </section>
  );
}
