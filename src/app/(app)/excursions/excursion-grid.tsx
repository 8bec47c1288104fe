"use client";

import type { ColDef, ICellRendererParams } from "ag-grid-community";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { DataGrid } from "@/components/grid/data-grid";
import { type ExcursionListItem, TRIGGER_LABELS } from "@/lib/schemas/excursions";
import { formatDateTime } from "@/lib/format";
import { StatusChip } from "./status-chip";

function age(iso: string): string {
  const hours = (Date.now() - Date.parse(iso)) / 3_600_000;
  if (hours < 1) return `${Math.max(1, Math.round(hours * 60))} min`;
  if (hours < 48) return `${Math.round(hours)} h`;
  return `${Math.round(hours / 24)} d`;
}

export function ExcursionGrid({ excursions }: { excursions: ExcursionListItem[] }) {
  const router = useRouter();
  const columns: ColDef<ExcursionListItem>[] = [
    { field: "number", headerName: "No.", maxWidth: 90, cellRenderer: ({ data }: ICellRendererParams<ExcursionListItem>) => data ? <Link className="text-accent hover:underline" href={`/excursions/${data.number}`}>{data.number}</Link> : null },
    { field: "status", headerName: "Status", maxWidth: 150, cellRenderer: ({ data }: ICellRendererParams<ExcursionListItem>) => (data ? <StatusChip status={data.status} /> : null) },
    { field: "product", headerName: "Product", maxWidth: 140 },
    { field: "trigger", headerName: "Trigger", maxWidth: 150, valueFormatter: (p) => TRIGGER_LABELS[p.value as ExcursionListItem["trigger"]] ?? p.value },
    { field: "title", headerName: "Title", minWidth: 280, flex: 2 },
    { headerName: "Lots", valueGetter: (p) => p.data?.lots.join(", ") ?? "" },
    { field: "owner", headerName: "Owner", valueFormatter: (p) => p.value ?? "—" },
    { field: "openedAt", headerName: "Age", maxWidth: 110, valueFormatter: (p) => age(p.value), tooltipValueGetter: (p) => formatDateTime(p.data?.openedAt) },
  ];
  return (
    <DataGrid
      label="Excursions"
      rows={excursions}
      columns={columns}
      rowId={(e) => e.id}
      height={Math.min(560, 60 + excursions.length * 42)}
      onRowDoubleClicked={(e) => e.data && router.push(`/excursions/${e.data.number}`)}
    />
  );
}
