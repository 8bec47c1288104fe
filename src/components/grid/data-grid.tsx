"use client";

import { AllCommunityModule, type ColDef, type GetRowIdParams, ModuleRegistry, themeQuartz } from "ag-grid-community";
import { AgGridReact, type AgGridReactProps } from "ag-grid-react";

// Registering the modules is required: without it pagination and filters fail with an unhelpful error.
ModuleRegistry.registerModules([AllCommunityModule]);

const lotwardenTheme = themeQuartz.withParams({
  fontFamily: "IBM Plex Sans, system-ui, sans-serif",
  fontSize: 13,
  headerFontWeight: 600,
  foregroundColor: "#1b2430",
  headerBackgroundColor: "#f3f5f8",
  borderColor: "#d5dbe3",
  accentColor: "#2f5d8a",
  rowHoverColor: "#eef2f7",
  spacing: 6,
});

export interface DataGridProps<T> extends Omit<AgGridReactProps<T>, "theme" | "rowData" | "columnDefs"> {
  rows: T[];
  columns: ColDef<T>[];
  rowId: (row: T) => string;
  height?: number | string;
  label: string;
}

/** A table over plain rows: sorting, filters and paging from the grid; the page decides the columns. */
export function DataGrid<T>({ rows, columns, rowId, height = 420, label, ...props }: DataGridProps<T>) {
  return (
    <div style={{ height }} aria-label={label} role="region">
      <AgGridReact<T>
        theme={lotwardenTheme}
        rowData={rows}
        columnDefs={columns}
        getRowId={(p: GetRowIdParams<T>) => rowId(p.data)}
        defaultColDef={{ sortable: true, resizable: true, filter: true, flex: 1, minWidth: 110 }}
        {...props}
      />
    </div>
  );
}
