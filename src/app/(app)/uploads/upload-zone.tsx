"use client";

import { useState } from "react";
import { useSWRConfig } from "swr";
import { formatBytes } from "@/lib/format";
import type { JobView } from "@/lib/schemas/ingest";
import { useJob } from "@/hooks/use-jobs";
import { ProgressBar } from "./progress-bar";

interface Item {
  key: string;
  file: File;
  sent: number;
  jobId: string | null;
  duplicate: boolean;
  error: string | null;
}

/** Sends one file as text/csv, reporting upload progress; resolves with the job or the §9 error message. */
function send(file: File, query: string, onProgress: (sent: number) => void): Promise<{ job: JobView; duplicate: boolean }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", `/api/v1/lots/ingest?filename=${encodeURIComponent(file.name)}${query}`);
    xhr.setRequestHeader("content-type", "text/csv");
    xhr.upload.onprogress = (e) => onProgress(e.loaded);
    xhr.onload = () => {
      const body = JSON.parse(xhr.responseText || "{}");
      if (xhr.status === 202 || xhr.status === 200) resolve({ job: body.job, duplicate: xhr.status === 200 });
      else reject(new Error(body?.error?.message ?? `HTTP ${xhr.status}`));
    };
    xhr.onerror = () => reject(new Error("The upload was interrupted; check the connection and try again."));
    xhr.send(file);
  });
}

function UploadRow({ item }: { item: Item }) {
  const { data: job } = useJob(item.jobId);
  const uploading = !item.jobId && !item.error;
  const processing = job && (job.status === "queued" || job.status === "running");
  return (
    <li className="rounded border border-slate-line p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2 text-sm">
        <span className="font-medium">{item.file.name}</span>
        <span className="tabular text-xs text-ink-muted">{formatBytes(item.file.size)}</span>
      </div>
      {uploading ? <ProgressBar label={`Uploading ${item.file.name}`} value={item.file.size ? item.sent / item.file.size : 0} tone="accent" /> : null}
      {processing ? <ProgressBar label={`Processing ${item.file.name}`} value={job.progress} tone="pass" /> : null}
      <p className="mt-1 text-xs text-ink-soft" role="status">
        {item.error ? <span className="text-alert">{item.error}</span> : null}
        {uploading ? "Uploading…" : null}
        {item.duplicate ? "These exact bytes were uploaded before; showing that job. " : null}
        {job?.status === "queued" ? "Queued" : null}
        {job?.status === "running" ? `Processing ${Math.round(job.progress * 100)} %` : null}
        {job?.status === "done" ? `Done: lot ${job.lot}, ${job.report?.dies ?? 0} dies on ${job.report?.wafers.length ?? 0} wafers${job.warnings.length ? `, ${job.warnings.length} warning(s)` : ""}` : null}
        {job?.status === "failed" ? <span className="text-alert">Failed: {job.error?.message}</span> : null}
      </p>
    </li>
  );
}

export function UploadZone({ products }: { products: string[] }) {
  const [items, setItems] = useState<Item[]>([]);
  const [dragging, setDragging] = useState(false);
  const [product, setProduct] = useState("");
  const { mutate } = useSWRConfig();
  const update = (key: string, patch: Partial<Item>) => setItems((all) => all.map((i) => (i.key === key ? { ...i, ...patch } : i)));

  function start(files: FileList | File[]) {
    const query = product ? `&product=${encodeURIComponent(product)}` : "";
    for (const file of Array.from(files)) {
      const key = `${file.name}-${file.size}-${Math.random()}`;
      setItems((all) => [{ key, file, sent: 0, jobId: null, duplicate: false, error: null }, ...all]);
      send(file, query, (sent) => update(key, { sent }))
        .then(({ job, duplicate }) => {
          update(key, { jobId: job.id, duplicate });
          void mutate((k) => typeof k === "string" && k.startsWith("/api/v1/jobs"));
        })
        .catch((error: Error) => update(key, { error: error.message }));
    }
  }

  return (
    <div>
      <div
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={(e) => {
          e.preventDefault();
          setDragging(false);
          start(e.dataTransfer.files);
        }}
        className={`flex flex-col items-center justify-center rounded-lg border-2 border-dashed px-6 py-10 text-center ${dragging ? "border-accent bg-accent/5" : "border-slate-line bg-slate-wash"}`}
      >
        <p className="text-base font-medium text-ink">Drop probe CSV files here</p>
        <p className="mt-1 max-w-xl text-sm text-ink-soft">
          One lot per file, whole or in part. Lot, product and chuck temperature come from the file&apos;s <code># key: value</code> lines; a
          product chosen here must agree with the file.
        </p>
        <div className="mt-4 flex flex-wrap items-center justify-center gap-3">
          <label className="inline-flex cursor-pointer items-center rounded bg-accent px-3 py-1.5 text-sm font-medium text-white hover:bg-accent-strong focus-within:ring-2 focus-within:ring-accent/50">
            Choose files
            <input type="file" accept=".csv,text/csv" multiple className="sr-only" onChange={(e) => e.target.files && start(e.target.files)} />
          </label>
          <label className="text-sm text-ink-soft">
            Product if the file has none{" "}
            <select value={product} onChange={(e) => setProduct(e.target.value)} className="ml-1 rounded border border-slate-line bg-white px-2 py-1 text-sm">
              <option value="">from the file</option>
              {products.map((p) => (
                <option key={p} value={p}>{p}</option>
              ))}
            </select>
          </label>
        </div>
      </div>
      {items.length ? <ul className="mt-4 space-y-2">{items.map((item) => <UploadRow key={item.key} item={item} />)}</ul> : null}
    </div>
  );
}
