import { Readable } from "node:stream";
import busboy from "busboy";
import { ingestFieldsSchema } from "@/lib/schemas/ingest";
import { AppError } from "@/server/http/errors";
import { apiRoute } from "@/server/http/route";
import { enqueueIngest } from "@/server/jobs/enqueue-ingest";

export const dynamic = "force-dynamic";
export const maxDuration = 3600;

/** The file part of a multipart upload, streamed: fields before it are collected, the file is never buffered whole. */
function multipartFile(request: Request): Promise<{ file: Readable; fileName: string | null; fields: Record<string, string> }> {
  return new Promise((resolve, reject) => {
    const fields: Record<string, string> = {};
    const parser = busboy({ headers: Object.fromEntries(request.headers), limits: { files: 1, fields: 20 } });
    parser.on("field", (name, value) => (fields[name] = value));
    parser.on("file", (_name, stream, info) => resolve({ file: stream, fileName: info.filename ?? null, fields }));
    parser.on("error", reject);
    parser.on("close", () => reject(new AppError("invalid", "The form has no file part")));
    Readable.fromWeb(request.body as never).pipe(parser);
  });
}

export const POST = apiRoute({ permission: "lots.upload" }, async ({ request, url, scope }) => {
  const type = (request.headers.get("content-type") ?? "").toLowerCase();
  if (!request.body) throw new AppError("invalid", "The request has no body");
  let body: Readable;
  let fileName: string | null = url.searchParams.get("filename");
  let formFields: Record<string, string> = {};
  let declaredBytes: number | null = null;
  if (type.startsWith("text/csv") || type.startsWith("application/csv") || type.startsWith("text/plain")) {
    body = Readable.fromWeb(request.body as never);
    // The body is the file: its Content-Length is the file's size (unless the body is encoded in transit).
    const length = Number(request.headers.get("content-length") ?? Number.NaN);
    if (Number.isSafeInteger(length) && length >= 0 && !request.headers.has("content-encoding")) declaredBytes = length;
  } else if (type.startsWith("multipart/form-data")) {
    const part = await multipartFile(request);
    body = part.file;
    fileName = part.fileName ?? fileName;
    formFields = part.fields;
  } else {
    throw new AppError("unsupported_media_type", "Send the probe file as text/csv, or as multipart/form-data with a file part");
  }
  const query = Object.fromEntries(["lot", "product", "chuck_temperature_k"].flatMap((k) => { const v = url.searchParams.get(k) ?? formFields[k]; return v ? [[k, v]] : []; }));
  const fields = ingestFieldsSchema.parse(query);
  const { job, created } = await enqueueIngest(scope, body, fileName, fields, declaredBytes);
  return Response.json({ job }, { status: created ? 202 : 200 });
});
