"use client";

import type { ColDef, GridApi, RowClickedEvent } from "ag-grid-community";
import { useEffect, useMemo, useRef } from "react";
import { DataGrid } from "@/components/grid/data-grid";
import { type ConductanceUnit, conductanceIn, UNIT_LABEL } from "@/lib/format";
import type { DieRecord } from "@/lib/schemas/lots";

export type ZonedDie = DieRecord & { zone: string };

const dieId = (d: { wafer: number; x: number; y: number }) => `${d.wafer}:${d.x}:${d.y}`;

/** The die table: sorting and filters per column (bin, G, out-of-window, zone, η); selection follows the map. */
export function DieTable({ dies, unit, selected, onSelect }: { dies: ZonedDie[]; unit: ConductanceUnit; selected: { wafer: number; x: number; y: number } | null; onSelect: (d: ZonedDie) => void }) {
  const api = useRef<GridApi<ZonedDie> | null>(null);
  const columns = useMemo<ColDef<ZonedDie>[]>(
    () => [
      { field: "x", maxWidth: 80, filter: "agNumberColumnFilter" },
      { field: "y", maxWidth: 80, filter: "agNumberColumnFilter" },
      { field: "bin", maxWidth: 130 },
      {
        headerName: `G (${UNIT_LABEL[unit]})`,
        colId: "g",
        valueGetter: (p) => (p.data?.conductanceS === null || p.data?.conductanceS === undefined ? null : conductanceIn(p.data.conductanceS, unit)),
        valueFormatter: (p) => (p.value === null || p.value === undefined ? "—" : Number((p.value as number).toPrecision(5)).toString()),
        filter: "agNumberColumnFilter",
        cellClass: "tabular",
      },
      { field: "nonlinearity", headerName: "η", valueFormatter: (p) => (p.value === null ? "—" : Number(p.value.toPrecision(3)).toString()), filter: "agNumberColumnFilter", maxWidth: 110 },
      { field: "r2", headerName: "R²", valueFormatter: (p) => (p.value === null ? "—" : (p.value as number).toFixed(5)), filter: "agNumberColumnFilter", maxWidth: 110 },
      { field: "pointsInWindow", headerName: "In window", maxWidth: 110, filter: "agNumberColumnFilter" },
      { field: "outOfWindow", headerName: "Out of window", valueFormatter: (p) => (p.value ? "yes" : ""), maxWidth: 130 },
      { field: "inked", valueFormatter: (p) => (p.value ? "inked" : ""), maxWidth: 100 },
      { field: "zone", maxWidth: 110 },
      { field: "reason", minWidth: 240, flex: 2 },
    ],
    [unit],
  );

  useEffect(() => {
    const grid = api.current;
    if (!grid || !selected) return;
    const node = grid.getRowNode(dieId(selected));
    if (node && !node.isSelected()) {
      node.setSelected(true, true);
      grid.ensureNodeVisible(node, "middle");
    }
  }, [selected]);

  return (
    <DataGrid<ZonedDie>
      label="Dies of the selected wafer"
      rows={dies}
      columns={columns}
      rowId={dieId}
      height={360}
      rowSelection={{ mode: "singleRow", checkboxes: false, enableClickSelection: true }}
      onGridReady={(e) => (api.current = e.api)}
      onRowClicked={(e: RowClickedEvent<ZonedDie>) => e.data && onSelect(e.data)}
      pagination
      paginationPageSize={100}
    />
  );
}
