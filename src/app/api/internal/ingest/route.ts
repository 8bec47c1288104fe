import { internalRoute } from "@/server/http/route";
import { runIngestJob } from "@/server/jobs/ingest-lot";
import { claimNextJob } from "@/server/jobs/queue";

export const dynamic = "force-dynamic";
export const maxDuration = 3600;

/** The worker's entry point: claims one queued ingest job (or one whose lease expired) and runs it. */
export const POST = internalRoute(async () => {
  const job = await claimNextJob();
  if (!job) return Response.json({ ran: null, more: false });
  const outcome = await runIngestJob(job);
  return Response.json({ ran: job.id, outcome, more: true });
});
