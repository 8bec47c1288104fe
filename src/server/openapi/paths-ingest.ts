import "server-only";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { access, AUTH_ERRORS, errors, json } from "./components";
import { ingestFormSchema, ingestQuery, jobEnvelopeSchema, jobListQuery, jobListResponseSchema, jobSchema, probeFileSchema } from "./schemas-jobs";
import { z } from "./zod-openapi";

export function registerIngestPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "post",
    path: "/api/v1/lots/ingest",
    operationId: "ingestLot",
    tags: ["Ingest"],
    summary: "Upload a probe lot file",
    description: [
      "Streams the file to object storage and queues its ingest job; files of 2 GB and more are never held in memory.",
      "lot, product and chuck_temperature_k (K) come from the file's metadata or from these fields; when both are given they must agree.",
      "Header problems, disagreements and unknown products are refused here with 422 and the 1-based line; row-level problems surface in the job.",
      "The same bytes again answer 200 with the first upload's job.",
    ].join(" "),
    ...access("lots.upload"),
    request: {
      query: ingestQuery,
      body: {
        required: true,
        description: "The file as the whole body (text/csv; application/csv and text/plain are accepted too), or as the file part of a form",
        content: { "text/csv": { schema: probeFileSchema }, "multipart/form-data": { schema: ingestFormSchema } },
      },
    },
    responses: {
      202: { description: "Accepted: a new job was queued", content: json(jobEnvelopeSchema) },
      200: { description: "These bytes were uploaded before: the first upload's job", content: json(jobEnvelopeSchema) },
      ...errors(...AUTH_ERRORS, "invalid", "too_large", "unsupported_media_type", "unprocessable"),
    },
  });

  registry.registerPath({
    method: "get",
    path: "/api/v1/jobs",
    operationId: "listJobs",
    tags: ["Ingest"],
    summary: "List ingest jobs",
    description: "Newest first.",
    ...access("data.read"),
    request: { query: jobListQuery },
    responses: { 200: { description: "The jobs", content: json(jobListResponseSchema) }, ...errors(...AUTH_ERRORS, "unprocessable") },
  });

  registry.registerPath({
    method: "get",
    path: "/api/v1/jobs/{id}",
    operationId: "getJob",
    tags: ["Ingest"],
    summary: "Get an ingest job",
    description: "Poll until status is done or failed. progress runs 0–1; error carries the 1-based line of the refusal.",
    ...access("data.read"),
    request: { params: z.object({ id: z.string().uuid().describe("Job id, from the upload's answer").openapi({ example: "5b0e8c1e-6f43-4c1a-9a51-0c5e2f1f7d3a" }) }) },
    responses: { 200: { description: "The job", content: json(jobSchema) }, ...errors(...AUTH_ERRORS, "not_found") },
  });
}
