"use client";

import { useMemo } from "react";
import { ChartFrame } from "@/components/charts/chart-frame";
import { AXIS_STYLE, seriesColour, TEXT_STYLE, TOOLTIP_STYLE, tooltipHtml } from "@/components/charts/chart-theme";
import type { WaferGeometry } from "@/domain/yield/geometry";
import { zoneTable, type ZoneRow } from "@/domain/yield/lot-analysis";
import type { ZoneYield } from "@/domain/yield/spatial-yield";
import { formatPercent } from "@/lib/format";
import { type AnalysisWafer, Caption, EmptyState, formatPoints, TABLE, TD, TD_NUM, TH } from "./analysis-parts";

const ZONES = ["centre", "middle", "edge"] as const;

function zoneCell(z: ZoneYield): string {
  return z.tested === 0 ? "—" : `${formatPercent(z.yield)} (${z.pass}/${z.tested})`;
}

function zoneOption(rows: readonly ZoneRow[]) {
  const names = rows.map((r) => (r.wafer === null ? "Lot" : `W${r.wafer}`));
  return {
    animation: false,
    textStyle: TEXT_STYLE,
    grid: { left: 56, right: 24, top: 40, bottom: 36 },
    legend: { top: 4, textStyle: TEXT_STYLE },
    tooltip: {
      ...TOOLTIP_STYLE,
      trigger: "axis" as const,
      axisPointer: { type: "shadow" as const },
      formatter: (params: unknown) => {
        const index = (Array.isArray(params) ? params[0] : params)?.dataIndex as number | undefined;
        const row = index === undefined ? undefined : rows[index];
        if (!row) return "";
        return tooltipHtml(names[index!] ?? "", [
          ...ZONES.map((zone) => ({ label: zone, value: zoneCell(row.zones[zone]) })),
          { label: "centre − edge", value: formatPoints(row.edgeVersusCentre.gap) },
        ]);
      },
    },
    xAxis: { type: "category" as const, data: names, ...AXIS_STYLE },
    yAxis: { type: "value" as const, name: "Yield (%)", min: 0, max: 100, ...AXIS_STYLE },
    series: ZONES.map((zone, i) => ({
      type: "bar" as const,
      name: zone,
      data: rows.map((r) => (r.zones[zone].yield === null ? null : 100 * r.zones[zone].yield!)),
      itemStyle: { color: seriesColour(i) },
      barMaxWidth: 18,
    })),
  };
}

/** Radial zones view: centre, middle and edge yield per wafer and for the lot, with the centre − edge gap, as bars and a table. */
export function AnalysisZones({ wafers, geometry }: { wafers: readonly AnalysisWafer[]; geometry: WaferGeometry }) {
  const probed = useMemo(() => wafers.filter((w) => w.dies.length > 0), [wafers]);
  const table = useMemo(() => zoneTable(probed), [probed]);
  const rows = useMemo(() => [...table.wafers, table.lot], [table]);
  const option = useMemo(() => zoneOption(rows), [rows]);
  const r = geometry.usableRadiusMm;
  if (probed.length === 0) return <EmptyState>No probed dies to place in zones.</EmptyState>;
  return (
    <div>
      <Caption>
        Dies are placed by the distance of their centre from the wafer centre (the middle of the probed extents), in three
        rings of equal area inside the usable radius R = {r.toFixed(1)} mm: centre up to {(r / Math.sqrt(3)).toFixed(1)} mm,
        middle up to {(r * Math.sqrt(2 / 3)).toFixed(1)} mm, edge up to {r.toFixed(1)} mm. Yield is PASS / tested in each ring;
        the lot row pools every die. A large positive centre − edge gap (in percentage points) is the signature of an edge ring.
      </Caption>
      <ChartFrame option={option} ariaLabel="Centre, middle and edge yield per wafer and for the lot" height={300} />
      <table className={`${TABLE} mt-3`} aria-label="Radial zone yield">
        <thead>
          <tr>
            <th className={TH}>Wafer</th>
            {ZONES.map((z) => (
              <th key={z} className={`${TH} text-right`}>{z} yield</th>
            ))}
            <th className={`${TH} text-right`}>Outside R (dies)</th>
            <th className={`${TH} text-right`}>Centre − edge</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.wafer ?? "lot"} className={row.wafer === null ? "font-semibold" : undefined}>
              <td className={TD}>{row.wafer === null ? "Lot" : `W${row.wafer}`}</td>
              {ZONES.map((z) => (
                <td key={z} className={TD_NUM}>{zoneCell(row.zones[z])}</td>
              ))}
              <td className={TD_NUM}>{row.zones.outside.tested}</td>
              <td className={TD_NUM}>{formatPoints(row.edgeVersusCentre.gap)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
