"use client";

import { WaferMap } from "@/components/charts/wafer-map";
import type { MapDie, MapGeometry } from "@/domain/wafer-map";

/** The report's bin wafer maps, one per wafer, in print-friendly thumbnails. */
export function ReportMaps({ wafers, geometry }: { wafers: { wafer: number; dies: MapDie[] }[]; geometry: MapGeometry }) {
  return (
    <div className="grid grid-cols-2 gap-4 sm:grid-cols-3 lg:grid-cols-5 print:grid-cols-4">
      {wafers.map((w) => (
        <figure key={w.wafer} className="break-inside-avoid rounded border border-slate-line p-2">
          <div className="h-[160px]">
            <WaferMap dies={w.dies} geometry={geometry} colourBy="bin" unit="µS" size="small" ariaLabel={`Bin map of wafer ${w.wafer}`} />
          </div>
          <figcaption className="mt-1 text-center text-xs font-medium">Wafer {w.wafer}</figcaption>
        </figure>
      ))}
    </div>
  );
}
