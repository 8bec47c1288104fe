import { type Kysely, sql } from "kysely";

// A queued ingest job wakes a waiting worker at once: every insert into ingest_jobs sends a notification on the
// lotwarden_ingest channel when its transaction commits (PostgreSQL LISTEN/NOTIFY), so the worker's long poll
// (src/server/jobs/job-signal.ts) claims the job without waiting out a poll interval.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create function notify_ingest_queued() returns trigger language plpgsql as $$
    begin
      perform pg_notify('lotwarden_ingest', '');
      return null;
    end $$`.execute(db);
  await sql`create trigger ingest_jobs_queued after insert on ingest_jobs for each statement execute function notify_ingest_queued()`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger ingest_jobs_queued on ingest_jobs`.execute(db);
  await sql`drop function notify_ingest_queued()`.execute(db);
}
