import "server-only";
import pg from "pg";
import { env } from "../env";

// The app's one LISTEN connection for the ingest queue's wake-up (migration 20261202_1100_ingest_signal): a worker
// with nothing to do waits here instead of sleeping out a poll interval. Kept on globalThis, like the pool, so a
// development hot reload does not open a second one.
const CHANNEL = "lotwarden_ingest";

interface Listener {
  client: pg.Client;
  ready: Promise<void>;
  waiters: Set<() => void>;
}

const global = globalThis as unknown as { lotwardenIngestListener?: Listener | null };

function listener(): Listener {
  const existing = global.lotwardenIngestListener;
  if (existing) return existing;
  const client = new pg.Client({ connectionString: env.DATABASE_URL });
  const waiters = new Set<() => void>();
  const wakeAll = () => {
    for (const wake of [...waiters]) wake();
  };
  const drop = () => {
    if (global.lotwardenIngestListener?.client === client) global.lotwardenIngestListener = null;
    wakeAll(); // a waiter re-polls the queue; the next wait opens a new connection
    client.end().catch(() => undefined);
  };
  client.on("notification", (message) => {
    if (message.channel === CHANNEL) wakeAll();
  });
  client.on("error", drop);
  client.on("end", drop);
  const ready = client.connect().then(() => client.query(`listen ${CHANNEL}`)).then(() => undefined);
  ready.catch(drop);
  const created: Listener = { client, ready, waiters };
  global.lotwardenIngestListener = created;
  return created;
}

/**
 * Starts listening for a queued ingest job and resolves once the LISTEN is in force; `wait(ms)` then resolves true
 * on the next notification (or one that came since), false after `ms`. Listen first, then look at the queue, then
 * wait: a job queued in between is not missed.
 */
export async function listenForIngest(): Promise<{ wait(ms: number): Promise<boolean> }> {
  const l = listener();
  let signalled = false;
  const mark = () => {
    signalled = true;
  };
  l.waiters.add(mark);
  try {
    await l.ready;
  } catch {
    l.waiters.delete(mark);
    return { wait: async () => false };
  }
  return {
    wait: (ms) =>
      new Promise<boolean>((resolve) => {
        l.waiters.delete(mark);
        if (signalled) return resolve(true);
        const timer = setTimeout(() => {
          l.waiters.delete(wake);
          resolve(false);
        }, ms);
        const wake = () => {
          clearTimeout(timer);
          l.waiters.delete(wake);
          resolve(true);
        };
        l.waiters.add(wake);
      }),
  };
}
