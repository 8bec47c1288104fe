import { internalRoute } from "@/server/http/route";
import { runIngestJob } from "@/server/jobs/ingest-lot";
import { listenForIngest } from "@/server/jobs/job-signal";
import { claimNextJob } from "@/server/jobs/queue";

export const dynamic = "force-dynamic";
export const maxDuration = 3600;

/** The longest a worker may ask to wait for a job in one request (`?waitMs=`). */
const MAX_WAIT_MS = 30_000;

/**
 * The worker's entry point: claims one queued ingest job (or one whose lease expired) and runs it. With
 * `?waitMs=N` and nothing queued, it waits up to N ms for a job to be queued (a long poll woken by the queue's
 * notification) instead of answering at once.
 */
export const POST = internalRoute(async ({ url }) => {
  const waitMs = Math.min(MAX_WAIT_MS, Math.max(0, Number(url.searchParams.get("waitMs")) || 0));
  let job = await claimNextJob();
  if (!job && waitMs > 0) {
    const signal = await listenForIngest();
    job = await claimNextJob();
    if (!job && (await signal.wait(waitMs))) job = await claimNextJob();
  }
  if (!job) return Response.json({ ran: null, more: false });
  const outcome = await runIngestJob(job);
  return Response.json({ ran: job.id, outcome, more: true });
});
