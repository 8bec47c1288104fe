import "server-only";
import type { Kysely } from "kysely";
import type { IngestReport, JobView } from "@/lib/schemas/ingest";
import { AppError } from "../../http/errors";
import type { Database } from "../schema";

function query(tx: Kysely<Database>) {
  return tx
    .selectFrom("ingest_jobs as j")
    .innerJoin("raw_files as f", (join) => join.onRef("f.tenant_id", "=", "j.tenant_id").onRef("f.id", "=", "j.raw_file_id"))
    .select([
      "j.id", "j.status", "j.progress", "j.lot_number", "j.product_code", "j.warnings", "j.error_code", "j.error_line", "j.error_message",
      "j.report", "j.attempts", "j.created_at", "j.started_at", "j.finished_at", "j.created_by", "f.file_name", "f.size_bytes",
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof query>["executeTakeFirstOrThrow"]>>;

function toView(r: Row): JobView {
  return {
    id: r.id,
    status: r.status,
    progress: r.progress,
    lot: r.lot_number,
    product: r.product_code,
    fileName: r.file_name,
    sizeBytes: Number(r.size_bytes),
    warnings: (r.warnings as JobView["warnings"]) ?? [],
    error: r.status === "failed" || r.error_message ? { line: r.error_line, message: r.error_message ?? "", code: r.error_code } : null,
    report: (r.report as IngestReport | null) ?? null,
    attempts: r.attempts,
    createdAt: r.created_at.toISOString(),
    startedAt: r.started_at?.toISOString() ?? null,
    finishedAt: r.finished_at?.toISOString() ?? null,
    createdBy: r.created_by,
  };
}

export async function getJob(tx: Kysely<Database>, id: string): Promise<JobView> {
  const row = await query(tx).where("j.id", "=", id).executeTakeFirst();
  if (!row) throw new AppError("not_found", "Job not found");
  return toView(row);
}

export async function findJobForFile(tx: Kysely<Database>, rawFileId: string): Promise<JobView | null> {
  const row = await query(tx).where("j.raw_file_id", "=", rawFileId).executeTakeFirst();
  return row ? toView(row) : null;
}

export async function listJobs(tx: Kysely<Database>, filter: { status?: JobView["status"] | undefined; limit: number }): Promise<JobView[]> {
  let q = query(tx).orderBy("j.created_at", "desc").limit(filter.limit);
  if (filter.status) q = q.where("j.status", "=", filter.status);
  return (await q.execute()).map(toView);
}
