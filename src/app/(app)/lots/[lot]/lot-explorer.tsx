"use client";

import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { type ReactNode, useCallback, useMemo, useRef } from "react";
import useSWR from "swr";
import type { ChartImageApi } from "@/components/charts/chart-export";
import { WaferMap } from "@/components/charts/wafer-map";
import { Button } from "@/components/ui/button";
import { conductanceUnit, type MapDie } from "@/domain/wafer-map";
import { assignZones, waferGeometry } from "@/domain/yield";
import { parseBin } from "@/domain/yield/lot-analysis";
import { fetcher, keys } from "@/lib/fetcher";
import { type ConductanceUnit, formatConductance, formatPercent } from "@/lib/format";
import type { DieRecord, WaferSummary } from "@/lib/schemas/lots";
import { AnalysisTabs } from "./analysis-tabs";
import { DieDrawer } from "./die-drawer";
import { DieTable, type ZonedDie } from "./die-table";

/** The fields of every die of the lot the page loads at once: the thumbnails' bins and marks, and the analyses. */
const LOT_MAP_FIELDS = "bin,conductanceS,outOfWindow,inked";
type LotMapDie = Pick<DieRecord, "wafer" | "x" | "y" | "bin" | "conductanceS" | "outOfWindow" | "inked">;

/** A thumbnail die: the fields it draws, the rest empty (a thumbnail has no tooltip). */
function thumbnailDie(d: LotMapDie): MapDie {
  return {
    x: d.x, y: d.y, conductanceS: d.conductanceS, bin: (parseBin(d.bin) ?? "NODATA") as MapDie["bin"], outOfWindow: d.outOfWindow, inked: d.inked,
    modes: null, nonlinearity: null, r2: null, pointsInWindow: 0, windowV: Number.NaN, temperatureK: Number.NaN,
  };
}

interface Props {
  lot: string;
  wafers: WaferSummary[];
  geometry: { dieWidthMm: number; dieHeightMm: number; waferDiameterMm: number; edgeExclusionMm: number };
  unit: ConductanceUnit;
  /** The spec window spans the conductance colour scale, so colours mean the same on every wafer of the product. */
  spec: { lowS: number | null; highS: number | null };
  canInk: boolean;
  /** Panels beside the selected wafer's map on wide screens, below it on narrow ones. */
  aside?: ReactNode;
}

/** The lot page's hero: the wafer strip, the selected wafer's map, its die table and the die drawer; state in the URL. */
export function LotExplorer({ lot, wafers, geometry, unit, spec, canInk, aside }: Props) {
  const router = useRouter();
  const pathname = usePathname();
  const params = useSearchParams();
  const wafer = Number(params.get("wafer") ?? wafers[0]?.wafer ?? 1);
  const colourBy = params.get("colour") === "bin" ? "bin" : "conductance";
  const [sx, sy] = (params.get("die") ?? "").split(",").map(Number);
  const selected = Number.isInteger(sx) && Number.isInteger(sy) && params.get("die") ? { wafer, x: sx!, y: sy! } : null;
  const png = useRef<ChartImageApi | null>(null);

  const setParams = useCallback(
    (changes: Record<string, string | null>) => {
      const next = new URLSearchParams(params.toString());
      for (const [k, v] of Object.entries(changes)) {
        if (v === null) next.delete(k);
        else next.set(k, v);
      }
      router.replace(`${pathname}?${next.toString()}`, { scroll: false });
    },
    [params, pathname, router],
  );

  // The selected wafer with every §5 field, for its map, table and tooltips; the whole lot with the four fields the
  // thumbnails and the analyses need (a 25 × 5,000-die lot in full would be some 45 MB of JSON).
  const { data, error, isLoading } = useSWR<{ dies: DieRecord[] }>(keys.dies(lot, { wafer }), fetcher);
  const { data: lotData, error: lotError } = useSWR<{ dies: LotMapDie[] }>(keys.dies(lot, { fields: LOT_MAP_FIELDS }), fetcher);
  const thumbnails = useMemo(() => {
    const map = new Map<number, MapDie[]>();
    for (const d of lotData?.dies ?? []) {
      const list = map.get(d.wafer) ?? [];
      list.push(thumbnailDie(d));
      map.set(d.wafer, list);
    }
    return map;
  }, [lotData]);
  const current = useMemo((): ZonedDie[] => {
    const dies = data?.dies ?? []; // fetched for this wafer alone
    return dies.length ? assignZones(dies, waferGeometry(geometry)).map((d) => ({ ...d, zone: d.zone })) : [];
  }, [data, geometry]);
  const mapUnit = conductanceUnit(unit === "uS" ? "µS" : unit);
  const summary = wafers.find((w) => w.wafer === wafer);

  if (error || lotError) return <p role="alert" className="text-sm text-alert">The dies could not be loaded: {(error ?? lotError).message}</p>;
  return (
    <div className="flex min-h-0 gap-0">
      <div className="min-w-0 flex-1 space-y-4">
        <nav aria-label="Wafers" className="flex gap-2 overflow-x-auto pb-2">
          {wafers.map((w) => (
            <button
              key={w.wafer}
              type="button"
              onClick={() => setParams({ wafer: String(w.wafer), die: null })}
              aria-pressed={w.wafer === wafer}
              className={`w-[104px] shrink-0 rounded border p-1 text-left focus:outline-none focus-visible:ring-2 focus-visible:ring-accent ${w.wafer === wafer ? "border-accent bg-accent/5" : "border-slate-line bg-slate-panel hover:border-ink-muted"}`}
            >
              <div className="h-[92px]">
                {thumbnails.get(w.wafer)?.length ? (
                  <WaferMap dies={thumbnails.get(w.wafer)!} geometry={geometry} colourBy="bin" unit={mapUnit} size="small" ariaLabel={`Wafer ${w.wafer} thumbnail`} />
                ) : (
                  <div className="h-full animate-pulse rounded bg-slate-wash" />
                )}
              </div>
              <p className="mt-1 text-xs font-medium">W{w.wafer}</p>
              <p className="tabular text-xs text-ink-soft">{formatPercent(w.yield)}{w.outOfWindow ? ` · ${w.outOfWindow}◎` : ""}</p>
            </button>
          ))}
        </nav>
        <div className="grid items-start gap-4 xl:grid-cols-[minmax(0,1fr)_380px]">
        <section aria-label={`Wafer ${wafer}`} className="min-w-0 rounded-lg border border-slate-line bg-slate-panel p-4">
          <div className="mb-2 flex flex-wrap items-center justify-between gap-3">
            <div>
              <h2 className="text-lg font-semibold">Wafer {wafer}</h2>
              {summary ? (
                <p className="tabular text-sm text-ink-soft">
                  yield {formatPercent(summary.yield)} ({summary.pass}/{summary.tested}) · median G {formatConductance(summary.medianConductanceS, unit)} · {summary.outOfWindow} out of window
                  {summary.windowLowS !== null ? ` (window ${formatConductance(summary.windowLowS, unit)} – ${formatConductance(summary.windowHighS, unit)})` : ""}
                </p>
              ) : null}
            </div>
            <div className="flex items-center gap-2" role="group" aria-label="Colour the map by">
              <Button variant={colourBy === "conductance" ? "primary" : "secondary"} onClick={() => setParams({ colour: null })}>Conductance</Button>
              <Button variant={colourBy === "bin" ? "primary" : "secondary"} onClick={() => setParams({ colour: "bin" })}>Bin</Button>
              <Button variant="secondary" onClick={() => png.current?.downloadPng(`${lot}-W${wafer}.png`)}>PNG</Button>
              <a className="rounded border border-slate-line px-3 py-1.5 text-sm hover:bg-slate-wash" href={keys.dies(lot, { wafer, format: "csv" })}>CSV</a>
            </div>
          </div>
          {/* The map keeps its own aspect ratio (1.25 : 1); capping the width caps its height at 560 px. */}
          <div className="mx-auto w-full max-w-[700px]">
            {isLoading || !current.length ? (
              <div className="flex h-[560px] items-center justify-center text-sm text-ink-muted">{isLoading ? "Loading the map…" : "No dies on this wafer."}</div>
            ) : (
              <WaferMap
                dies={current as MapDie[]}
                geometry={geometry}
                colourBy={colourBy}
                unit={mapUnit}
                selected={selected}
                onSelect={(d) => setParams({ die: `${d.x},${d.y}` })}
                ariaLabel={`Wafer map of wafer ${wafer}, coloured by ${colourBy}`}
                onReady={(api) => (png.current = api)}
                valueRange={spec.lowS !== null && spec.highS !== null ? { minS: spec.lowS, maxS: spec.highS } : null}
              />
            )}
          </div>
        </section>
        {aside ? <div className="space-y-4">{aside}</div> : null}
        </div>
        <section aria-label="Die table" className="rounded-lg border border-slate-line bg-slate-panel p-4">
          <DieTable dies={current} unit={unit} selected={selected} onSelect={(d) => setParams({ die: `${d.x},${d.y}` })} csvFileName={`${lot}-W${wafer}-dies.csv`} />
        </section>
        <AnalysisTabs lot={lot} wafers={wafers} dies={lotData?.dies ?? []} geometry={geometry} unit={unit} />
      </div>
      {selected ? <DieDrawer lot={lot} wafer={wafer} x={selected.x} y={selected.y} unit={unit} canInk={canInk} onClose={() => setParams({ die: null })} /> : null}
    </div>
  );
}
