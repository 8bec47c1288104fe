"use client";

import type { ColDef, GridApi, RowClickedEvent } from "ag-grid-community";
import { useEffect, useMemo, useRef, useState } from "react";
import { DataGrid } from "@/components/grid/data-grid";
import { Button } from "@/components/ui/button";
import { dieCsv } from "@/lib/die-csv";
import { downloadText } from "@/lib/download";
import { type ConductanceUnit, conductanceIn, UNIT_LABEL } from "@/lib/format";
import type { DieRecord } from "@/lib/schemas/lots";

export type ZonedDie = DieRecord & { zone: string };

const dieId = (d: { wafer: number; x: number; y: number }) => `${d.wafer}:${d.x}:${d.y}`;

/** Rows the filters leave, over every page. */
function countFiltered(grid: GridApi<ZonedDie>): number {
  let n = 0;
  grid.forEachNodeAfterFilter(() => n++);
  return n;
}

interface DieTableProps {
  dies: ZonedDie[];
  unit: ConductanceUnit;
  selected: { wafer: number; x: number; y: number } | null;
  onSelect: (d: ZonedDie) => void;
  /** Name of the CSV the export saves, e.g. "TW2610-0035-W3-dies.csv". */
  csvFileName: string;
}

/**
 * The die table: sorting and filters per column (bin, G, out-of-window, zone, η); selection follows the map. The
 * export saves the rows the filters leave, in the table's order, as CSV with the §9 names and SI values (the API's
 * format=csv columns).
 */
export function DieTable({ dies, unit, selected, onSelect, csvFileName }: DieTableProps) {
  const api = useRef<GridApi<ZonedDie> | null>(null);
  const [shown, setShown] = useState<number | null>(null);
  const visibleRows = (): ZonedDie[] => {
    const rows: ZonedDie[] = [];
    api.current?.forEachNodeAfterFilterAndSort((node) => node.data && rows.push(node.data));
    return rows;
  };
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

  const count = shown ?? dies.length;
  return (
    <div className="space-y-2">
      <div className="flex items-center justify-between gap-3 text-sm">
        <p className="tabular text-ink-soft" aria-live="polite">{count === dies.length ? `${dies.length} dies` : `${count} of ${dies.length} dies match the filters`}</p>
        <Button variant="secondary" disabled={count === 0} onClick={() => downloadText(dieCsv(visibleRows()), csvFileName, "text/csv")}>CSV of these dies</Button>
      </div>
    <DataGrid<ZonedDie>
      label="Dies of the selected wafer"
      rows={dies}
      columns={columns}
      rowId={dieId}
      height={360}
      rowSelection={{ mode: "singleRow", checkboxes: false, enableClickSelection: true }}
      onGridReady={(e) => (api.current = e.api)}
      onFilterChanged={(e) => setShown(countFiltered(e.api))}
      onRowDataUpdated={(e) => setShown(countFiltered(e.api))}
      onRowClicked={(e: RowClickedEvent<ZonedDie>) => e.data && onSelect(e.data)}
      pagination
      paginationPageSize={100}
    />
    </div>
  );
}
