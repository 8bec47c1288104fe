export {};

// The background worker: a small loop that asks the app to do its queued work through the internal routes
// (ingest jobs, outbound e-mail). Several workers may run; the routes claim work with row locks.
// Usage: node --import tsx src/cli/worker.ts   (APP_URL and WORKER_SECRET from the environment)
const appUrl = process.env.APP_URL;
const secret = process.env.WORKER_SECRET;
if (!appUrl || !secret) {
  process.stderr.write("worker: APP_URL and WORKER_SECRET are required\n");
  process.exit(2);
}
const intervalMs = Number(process.env.WORKER_INTERVAL_MS ?? 1000);
const tasks = (process.env.WORKER_TASKS ?? "ingest,mail").split(",").filter(Boolean);
let stopping = false;

async function call(task: string): Promise<boolean> {
  const response = await fetch(`${appUrl}/api/internal/${task}`, { method: "POST", headers: { authorization: `Bearer ${secret}` } });
  if (!response.ok) throw new Error(`${task}: HTTP ${response.status}`);
  const body = (await response.json()) as { more?: boolean };
  return Boolean(body.more);
}

async function loop(): Promise<void> {
  while (!stopping) {
    let more = false;
    for (const task of tasks) {
      try {
        more = (await call(task)) || more;
      } catch (error) {
        process.stderr.write(`worker: ${new Date().toISOString()} ${String(error)}\n`);
      }
    }
    if (!more) await new Promise((r) => setTimeout(r, intervalMs));
  }
}

for (const signal of ["SIGTERM", "SIGINT"] as const) process.on(signal, () => (stopping = true));
process.stdout.write(`worker: polling ${appUrl} every ${intervalMs} ms for ${tasks.join(", ")}\n`);
await loop();
process.exit(0);
