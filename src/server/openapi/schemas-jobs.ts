import "server-only";
import { type IngestReport, ingestFieldsSchema, type JobView, jobListSchema } from "@/lib/schemas/ingest";
import { binCounts, isoDateTime } from "./components";
import { describeFields, mirrors, z } from "./zod-openapi";

const ingestReportSchema = mirrors<IngestReport>()(
  z
    .object({
      rows: z.number().int().describe("Data rows read"),
      skippedRows: z.number().int().describe("Bad rows skipped under the tenant's error budget (default 0.1 % of rows)"),
      warningsOmitted: z.number().int().describe("Warnings beyond those listed"),
      dies: z.number().int().describe("Dies computed"),
      wafers: z.array(z.number().int()).describe("Wafer slots the file added or replaced"),
      ignoredColumns: z.array(z.string()).describe("Columns the file has that Lotwarden does not use"),
      attributes: z.record(z.string(), z.string()).describe("The file's other metadata, kept as lot attributes"),
      bins: binCounts,
      seconds: z.number().describe("Processing time, in s"),
    })
    .openapi("IngestReport"),
);

export const jobSchema = mirrors<JobView>()(
  z
    .object({
      id: z.string().uuid(),
      status: z.enum(["queued", "running", "done", "failed"]),
      progress: z.number().min(0).max(1).describe("Fraction of the file processed, 0–1"),
      lot: z.string().nullable().describe("Lot number, once known"),
      product: z.string().nullable().describe("Product code, once known"),
      fileName: z.string().nullable(),
      sizeBytes: z.number().int().describe("Size of the uploaded file, in bytes"),
      warnings: z.array(z.object({ line: z.number().int(), message: z.string() })).describe("Skipped rows and other warnings, each with its 1-based physical line"),
      error: z
        .object({ line: z.number().int().nullable().describe("1-based physical line of the file, when the refusal has one"), message: z.string(), code: z.string().nullable() })
        .nullable()
        .describe("Why the job failed; a failed job commits nothing and the lot keeps what it had"),
      report: ingestReportSchema.nullable(),
      attempts: z.number().int(),
      createdAt: isoDateTime,
      startedAt: isoDateTime.nullable(),
      finishedAt: isoDateTime.nullable(),
      createdBy: z.string().describe("Who uploaded: a person's name or the API key's label"),
    })
    .openapi("Job", { description: "An ingest job; poll it until status is done or failed." }),
);

export const jobEnvelopeSchema = z.object({ job: jobSchema }).openapi("JobEnvelope");
export const jobListResponseSchema = z.object({ jobs: z.array(jobSchema) }).openapi("JobList");

export const jobListQuery = describeFields(jobListSchema, {
  status: "Only jobs in this state",
  limit: "Newest jobs first, at most this many",
});

export const ingestQuery = describeFields(ingestFieldsSchema, {
  lot: "Lot number, when the file has no `# lot:` line; must agree with the file when both are given",
  product: "Product code, when the file has no `# product:` line; must agree with the file",
  chuck_temperature_k: "Chuck temperature in K, when the file has no `# chuck_temperature_k:` line; must agree with the file",
}).extend({ filename: z.string().optional().describe("File name to keep with the raw file (a multipart part's own name wins)") });

export const probeFileSchema = z
  .string()
  .describe("The §4 probe lot file: `# key: value` metadata lines, a header `wafer,die_x,die_y,bias_<unit>,current_<unit>`, one row per point. UTF-8 with or without BOM, LF or CRLF.")
  .openapi({ example: "# lot: TW2611-0147\n# product: VD-NW40\n# chuck_temperature_k: 300.15\nwafer,die_x,die_y,bias_mv,current_na\n1,0,0,-10,-774.2\n" });

export const ingestFormSchema = z.object({
  file: z.string().describe("The probe lot file (one file part; fields before it are read first)").meta({ format: "binary", contentMediaType: "text/csv" }),
  lot: z.string().optional().describe("As the `lot` query field"),
  product: z.string().optional().describe("As the `product` query field"),
  chuck_temperature_k: z.string().optional().describe("As the `chuck_temperature_k` query field, in K"),
});
