import { z } from "zod";

/** The optional upload fields of §9 (query or form): they must agree with the file's own metadata. */
export const ingestFieldsSchema = z.object({
  lot: z.string().trim().min(1).max(64).regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "Lot numbers use letters, digits, dot, dash or underscore").optional(),
  product: z.string().trim().min(1).max(40).optional(),
  chuck_temperature_k: z.coerce.number().finite().positive().max(1000).optional(),
});
export type IngestFields = z.infer<typeof ingestFieldsSchema>;

export interface JobView {
  id: string;
  status: "queued" | "running" | "done" | "failed";
  progress: number;
  lot: string | null;
  product: string | null;
  fileName: string | null;
  sizeBytes: number;
  warnings: { line: number; message: string }[];
  error: { line: number | null; message: string; code: string | null } | null;
  report: IngestReport | null;
  attempts: number;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  createdBy: string;
}

export interface IngestReport {
  rows: number;
  skippedRows: number;
  warningsOmitted: number;
  dies: number;
  wafers: number[];
  ignoredColumns: string[];
  attributes: Record<string, string>;
  bins: Record<string, number>;
  seconds: number;
}

export const jobListSchema = z.object({
  status: z.enum(["queued", "running", "done", "failed"]).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
