"use client";

import type { ColDef } from "ag-grid-community";
import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import { DataGrid } from "@/components/grid/data-grid";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/page-header";
import { fetcher, keys } from "@/lib/fetcher";
import { type ConductanceUnit, formatConductance, formatDateTime, formatPercent } from "@/lib/format";
import { LOT_STATUSES, type LotListItem } from "@/lib/schemas/lots";

const PAGE_SIZE = 50;

/** All lots, filtered and paged on the server (§9 GET /api/v1/lots). */
export function LotTable({ products }: { products: { code: string; unit: ConductanceUnit }[] }) {
  const [product, setProduct] = useState("");
  const [status, setStatus] = useState("");
  const [q, setQ] = useState("");
  const [page, setPage] = useState(1);
  const { data, error, isLoading } = useSWR<{ lots: LotListItem[]; total: number }>(keys.lots({ product, status, q, page, pageSize: PAGE_SIZE }), fetcher, { keepPreviousData: true });
  const unitOf = (code: string) => products.find((p) => p.code === code)?.unit ?? "uS";
  const columns: ColDef<LotListItem>[] = [
    { field: "lot", headerName: "Lot", minWidth: 150, cellRenderer: (p: { value: string }) => <Link className="font-medium text-accent underline-offset-2 hover:underline" href={`/lots/${encodeURIComponent(p.value)}`}>{p.value}</Link> },
    { field: "product", maxWidth: 130 },
    { field: "customer", valueFormatter: (p) => p.value ?? "internal" },
    { field: "status", maxWidth: 120 },
    { field: "wafers", maxWidth: 100 },
    { field: "yield", valueFormatter: (p) => formatPercent(p.value), cellClass: "tabular", maxWidth: 110 },
    { field: "medianConductanceS", headerName: "Median G", valueFormatter: (p) => (p.data ? formatConductance(p.value, unitOf(p.data.product)) : ""), cellClass: "tabular" },
    { field: "outOfWindow", headerName: "Out of window", maxWidth: 130 },
    { field: "chuckTemperatureK", headerName: "Chuck (K)", valueFormatter: (p) => (p.value as number).toFixed(2), maxWidth: 110 },
    { field: "station", maxWidth: 110 },
    { field: "probedAt", headerName: "Probed", valueFormatter: (p) => formatDateTime(p.value), minWidth: 170 },
  ];
  const pages = data ? Math.max(1, Math.ceil(data.total / PAGE_SIZE)) : 1;
  const select = "rounded border border-slate-line bg-white px-2 py-1.5 text-sm";
  return (
    <section aria-label="Lots" className="rounded-lg border border-slate-line bg-slate-panel p-4">
      <div className="mb-3 flex flex-wrap items-end gap-3">
        <label className="text-sm text-ink-soft">Product <select className={select} value={product} onChange={(e) => { setProduct(e.target.value); setPage(1); }}><option value="">all</option>{products.map((p) => <option key={p.code}>{p.code}</option>)}</select></label>
        <label className="text-sm text-ink-soft">Status <select className={select} value={status} onChange={(e) => { setStatus(e.target.value); setPage(1); }}><option value="">all</option>{LOT_STATUSES.map((s) => <option key={s}>{s}</option>)}</select></label>
        <label className="text-sm text-ink-soft">Lot number <input className={select} value={q} onChange={(e) => { setQ(e.target.value); setPage(1); }} placeholder="search" /></label>
        <span className="ml-auto text-sm text-ink-muted tabular">{data ? `${data.total} lots` : ""}</span>
      </div>
      {error ? <p role="alert" className="text-sm text-alert">The lots could not be loaded: {error.message}</p> : null}
      {!error && data && data.total === 0 ? <EmptyState>No lots match. Upload probe files on the Uploads page.</EmptyState> : null}
      {!error && (isLoading || (data && data.total > 0)) ? (
        <>
          <DataGrid label="Lot table" rows={data?.lots ?? []} columns={columns} rowId={(l) => l.lot} height={560} loading={isLoading} defaultColDef={{ sortable: false, filter: false, resizable: true, flex: 1, minWidth: 100 }} />
          <div className="mt-3 flex items-center justify-end gap-2 text-sm">
            <Button variant="secondary" disabled={page <= 1} onClick={() => setPage(page - 1)}>Previous</Button>
            <span className="tabular text-ink-soft">page {page} of {pages}</span>
            <Button variant="secondary" disabled={page >= pages} onClick={() => setPage(page + 1)}>Next</Button>
          </div>
        </>
      ) : null}
    </section>
  );
}
