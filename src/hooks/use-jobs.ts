"use client";

import useSWR from "swr";
import { fetcher, keys } from "@/lib/fetcher";
import type { JobView } from "@/lib/schemas/ingest";

/** The newest ingest jobs, refreshed while any is still queued or running. */
export function useJobs(limit = 50) {
  return useSWR<{ jobs: JobView[] }>(keys.jobs(limit), fetcher, {
    refreshInterval: (data) => (data?.jobs.some((j) => j.status === "queued" || j.status === "running") ? 1000 : 5000),
  });
}

/** One job, polled until it is done or failed. */
export function useJob(id: string | null) {
  return useSWR<JobView>(id ? keys.job(id) : null, fetcher, {
    refreshInterval: (job) => (job && (job.status === "done" || job.status === "failed") ? 0 : 750),
  });
}
