import "server-only";
import type pg from "pg";
import { pool } from "../db/client";

// The ingest queue: ingest_jobs rows claimed with FOR UPDATE SKIP LOCKED and held by a lease the worker renews.
// A job whose worker died is reclaimed when its lease runs out; its half-done transaction was rolled back with the
// connection, and the attempt number fences off a stale worker that wakes up late.
export const LEASE_SECONDS = 90;
export const MAX_ATTEMPTS = 3;

export interface ClaimedJob {
  tenantId: string;
  id: string;
  rawFileId: string;
  lotNumber: string;
  productCode: string;
  chuckTemperatureK: number | null;
  attempts: number;
}

/** Runs statements as the job runner, which alone may see every tenant's jobs. */
export async function asJobRunner<T>(fn: (client: pg.PoolClient) => Promise<T>): Promise<T> {
  const client = await pool.connect();
  try {
    await client.query("begin");
    await client.query("select set_config('app.job_runner', 'on', true)");
    const result = await fn(client);
    await client.query("commit");
    return result;
  } catch (error) {
    await client.query("rollback").catch(() => undefined);
    throw error;
  } finally {
    client.release();
  }
}

/** Claims the oldest due job, optionally only of one tenant (a worker pinned to a tenant). */
export async function claimNextJob(options: { tenantId?: string } = {}): Promise<ClaimedJob | null> {
  return asJobRunner(async (client) => {
    const { rows } = await client.query(
      `with next as (
         select tenant_id, id from ingest_jobs
         where ((status = 'queued' and run_after <= now()) or (status = 'running' and lease_until < now()))
           and ($2::uuid is null or tenant_id = $2::uuid)
         order by created_at
         limit 1
         for update skip locked)
       update ingest_jobs j
          set status = 'running', attempts = j.attempts + 1, lease_until = now() + make_interval(secs => $1),
              started_at = coalesce(j.started_at, now()), progress = 0
         from next
        where j.tenant_id = next.tenant_id and j.id = next.id
       returning j.tenant_id, j.id, j.raw_file_id, j.lot_number, j.product_code, j.chuck_temperature_k, j.attempts`,
      [LEASE_SECONDS, options.tenantId ?? null],
    );
    const r = rows[0];
    if (!r) return null;
    return { tenantId: r.tenant_id, id: r.id, rawFileId: r.raw_file_id, lotNumber: r.lot_number, productCode: r.product_code, chuckTemperatureK: r.chuck_temperature_k, attempts: r.attempts };
  });
}

/** Renews the lease and reports progress; false when another worker has taken the job over. */
export async function heartbeat(job: ClaimedJob, progress: number): Promise<boolean> {
  return asJobRunner(async (client) => {
    const { rowCount } = await client.query(
      `update ingest_jobs set lease_until = now() + make_interval(secs => $3), progress = $4
        where tenant_id = $1 and id = $2 and attempts = $5 and status = 'running'`,
      [job.tenantId, job.id, LEASE_SECONDS, Math.min(0.99, Math.max(0, progress)), job.attempts],
    );
    return rowCount === 1;
  });
}

export async function failJob(job: ClaimedJob, error: { code: string; line: number | null; message: string }, warnings: unknown[] = []): Promise<void> {
  await asJobRunner((client) =>
    client.query(
      `update ingest_jobs set status = 'failed', finished_at = now(), lease_until = null, error_code = $3, error_line = $4, error_message = $5, warnings = $6
        where tenant_id = $1 and id = $2 and attempts = $7`,
      [job.tenantId, job.id, error.code, error.line, error.message, JSON.stringify(warnings), job.attempts],
    ),
  );
}

/** An unexpected failure: try again later with back-off (30 s, 2 min, …) until MAX_ATTEMPTS. */
export async function retryJob(job: ClaimedJob, message: string): Promise<void> {
  if (job.attempts >= MAX_ATTEMPTS) {
    await failJob(job, { code: "internal", line: null, message: `Processing failed ${job.attempts} times; the last error was: ${message}` });
    return;
  }
  const delaySeconds = 30 * 4 ** (job.attempts - 1);
  await asJobRunner((client) =>
    client.query(
      `update ingest_jobs set status = 'queued', lease_until = null, run_after = now() + make_interval(secs => $3), error_message = $4
        where tenant_id = $1 and id = $2 and attempts = $5`,
      [job.tenantId, job.id, delaySeconds, `attempt ${job.attempts} failed: ${message}; retrying`, job.attempts],
    ),
  );
}
