export {};

// The background worker: small loops that ask the app to do its queued work through the internal routes (ingest
// jobs, outbound e-mail), one loop per task. Several workers may run; the routes claim work with row locks.
// The ingest loop long-polls: with nothing queued the app holds the request until a job is queued (PostgreSQL
// LISTEN/NOTIFY) or LONG_POLL_MS pass, so a new upload starts at once rather than after a poll interval.
// Usage: node --import tsx src/cli/worker.ts   (APP_URL and WORKER_SECRET from the environment)
const appUrl = process.env.APP_URL;
const secret = process.env.WORKER_SECRET;
if (!appUrl || !secret) {
  process.stderr.write("worker: APP_URL and WORKER_SECRET are required\n");
  process.exit(2);
}
const intervalMs = Number(process.env.WORKER_INTERVAL_MS ?? 1000);
const LONG_POLL_MS = 20_000;
const tasks = (process.env.WORKER_TASKS ?? "ingest,mail").split(",").filter(Boolean);
const stop = new AbortController();

async function call(task: string): Promise<boolean> {
  const query = task === "ingest" ? `?waitMs=${LONG_POLL_MS}` : "";
  const response = await fetch(`${appUrl}/api/internal/${task}${query}`, { method: "POST", headers: { authorization: `Bearer ${secret}` }, signal: stop.signal });
  if (!response.ok) throw new Error(`${task}: HTTP ${response.status}`);
  const body = (await response.json()) as { more?: boolean };
  return Boolean(body.more);
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function loop(task: string): Promise<void> {
  while (!stop.signal.aborted) {
    const started = Date.now();
    let more = false;
    try {
      more = await call(task);
    } catch (error) {
      if (stop.signal.aborted) return;
      process.stderr.write(`worker: ${new Date().toISOString()} ${String(error)}\n`);
    }
    // A long poll that came back empty has already waited; anything quicker (an error, a task without long poll) sleeps.
    if (!more && Date.now() - started < intervalMs) await sleep(intervalMs);
  }
}

// Stopping aborts the requests in flight: a long poll ends at once; a job the app is running carries on there
// under its lease, and is the app's to finish.
for (const signal of ["SIGTERM", "SIGINT"] as const) process.on(signal, () => stop.abort());
process.stdout.write(`worker: ${tasks.join(", ")} on ${appUrl} (ingest long-polls up to ${LONG_POLL_MS} ms, others every ${intervalMs} ms)\n`);
await Promise.all(tasks.map(loop));
process.exit(0);
