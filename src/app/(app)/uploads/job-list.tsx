"use client";

import type { ColDef } from "ag-grid-community";
import Link from "next/link";
import { DataGrid } from "@/components/grid/data-grid";
import { EmptyState } from "@/components/ui/page-header";
import { formatBytes, formatDateTime } from "@/lib/format";
import type { JobView } from "@/lib/schemas/ingest";
import { useJobs } from "@/hooks/use-jobs";

const STATUS_STYLE: Record<JobView["status"], string> = {
  queued: "bg-slate-wash text-ink-soft",
  running: "bg-accent/10 text-accent-strong",
  done: "bg-bin-pass/10 text-[#00694d]",
  failed: "bg-alert-wash text-alert",
};

function outcome(job: JobView): string {
  if (job.status === "failed") return job.error?.message ?? "failed";
  if (job.status === "done") {
    const r = job.report;
    const skipped = r?.skippedRows ? `, ${r.skippedRows} row(s) skipped` : "";
    const ignored = r?.ignoredColumns.length ? `; ignored columns: ${r.ignoredColumns.join(", ")}` : "";
    return `${r?.dies ?? 0} dies, ${r?.rows ?? 0} rows${skipped}${ignored}`;
  }
  return job.status === "running" ? `${Math.round(job.progress * 100)} %` : "waiting for the worker";
}

const columns: ColDef<JobView>[] = [
  { field: "createdAt", headerName: "Uploaded", valueFormatter: (p) => formatDateTime(p.value), sort: "desc", minWidth: 170 },
  { field: "fileName", headerName: "File", minWidth: 180 },
  { field: "sizeBytes", headerName: "Size", valueFormatter: (p) => formatBytes(p.value ?? 0), maxWidth: 110 },
  {
    field: "lot",
    headerName: "Lot",
    // The cell becomes a link when the job is done, while its value (the lot number) stays the same: the grid
    // refreshes a cell only when its value changes, so this one is told it always has.
    equals: () => false,
    cellRenderer: (p: { data?: JobView }) => (p.data?.lot && p.data.status === "done" ? <Link className="text-accent underline" href={`/lots/${encodeURIComponent(p.data.lot)}`}>{p.data.lot}</Link> : (p.data?.lot ?? "—")),
  },
  {
    field: "status",
    headerName: "Status",
    maxWidth: 120,
    cellRenderer: (p: { data?: JobView }) => (p.data ? <span className={`rounded px-2 py-0.5 text-xs font-medium ${STATUS_STYLE[p.data.status]}`}>{p.data.status}</span> : null),
  },
  { headerName: "Result", valueGetter: (p) => (p.data ? outcome(p.data) : ""), flex: 3, minWidth: 280, tooltipValueGetter: (p) => (p.data ? outcome(p.data) : "") },
  { headerName: "Warnings", valueGetter: (p) => p.data?.warnings.length ?? 0, maxWidth: 120 },
  { field: "createdBy", headerName: "By", maxWidth: 200 },
];

export function JobList() {
  const { data, error, isLoading } = useJobs(100);
  if (error) return <p role="alert" className="text-sm text-alert">The job list could not be loaded: {error.message}</p>;
  if (isLoading) return <p className="text-sm text-ink-muted">Loading jobs…</p>;
  if (!data?.jobs.length) return <EmptyState>No files uploaded yet. Drop a probe CSV above, or let a station post to /api/v1/lots/ingest.</EmptyState>;
  const warnings = data.jobs.filter((j) => j.warnings.length).slice(0, 3);
  return (
    <>
      <DataGrid label="Ingest jobs" rows={data.jobs} columns={columns} rowId={(j) => j.id} height={420} pagination paginationPageSize={20} />
      {warnings.map((j) => (
        <details key={j.id} className="mt-3 text-sm">
          <summary className="cursor-pointer text-ink-soft">{j.fileName}: {j.warnings.length} warning(s)</summary>
          <ul className="mt-1 list-disc pl-6 text-xs text-ink-soft">
            {j.warnings.slice(0, 20).map((w) => (
              <li key={`${w.line}-${w.message}`}>line {w.line}: {w.message}</li>
            ))}
          </ul>
        </details>
      ))}
    </>
  );
}
