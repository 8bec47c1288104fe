import "server-only";
import { Readable } from "node:stream";
import { type ProbeFileHeader, ProbeFileError, readProbeFile } from "@/domain/probe-file";
import type { IngestFields, JobView } from "@/lib/schemas/ingest";
import { findJobForFile, getJob } from "../db/queries/jobs";
import { findProduct } from "../db/queries/products";
import { type Scope, withScope } from "../db/scope";
import { env } from "../env";
import { AppError } from "../http/errors";
import { deleteObject, promoteUpload, rawFileKey, streamToObjectStore } from "../storage/raw-files";

/** Reads just the header and metadata from the first bytes of a file; null when the head holds no complete header. */
async function readHead(head: Buffer): Promise<ProbeFileHeader | null> {
  const reader = readProbeFile(Readable.from([head]), { errorBudgetFraction: 1 });
  try {
    const first = await reader.next();
    return !first.done && first.value.kind === "header" ? first.value.header : null;
  } catch (error) {
    // A head cut mid-file can end in a partial row; only errors about the header itself count here.
    if (error instanceof ProbeFileError && (error.code === "missing_column" || error.code === "unknown_unit" || error.code === "bad_header" || error.code === "encoding")) throw error;
    return null;
  } finally {
    await reader.return(undefined as never).catch(() => undefined);
  }
}

export interface ResolvedLotFields {
  lot: string;
  product: string;
  chuckTemperatureK: number | null;
}


/**
 * §4: lot, product and chuck temperature come from the file or from the upload; the file wins when both agree,
 * and a disagreement is refused naming the field and both values.
 */
export function reconcileFields(metadata: Record<string, string>, fields: IngestFields, metadataLine: (key: string) => number | null): ResolvedLotFields {
  const problems: { field: string; line: number | null; message: string }[] = [];
  const pick = (key: "lot" | "product") => {
    const inFile = metadata[key]?.trim();
    const given = fields[key];
    if (inFile && given && inFile !== given) problems.push({ field: key, line: metadataLine(key), message: `the file says ${key} "${inFile}" but the upload says "${given}"` });
    return inFile || given || null;
  };
  const lot = pick("lot");
  const product = pick("product");
  const rawTemperature = metadata.chuck_temperature_k?.trim();
  let chuckTemperatureK: number | null = fields.chuck_temperature_k ?? null;
  if (rawTemperature) {
    const inFile = Number(rawTemperature);
    if (!Number.isFinite(inFile) || inFile <= 0) problems.push({ field: "chuck_temperature_k", line: metadataLine("chuck_temperature_k"), message: `chuck_temperature_k "${rawTemperature}" is not a temperature in K` });
    else if (chuckTemperatureK !== null && Math.abs(inFile - chuckTemperatureK) > 1e-6) problems.push({ field: "chuck_temperature_k", line: metadataLine("chuck_temperature_k"), message: `the file says chuck_temperature_k ${inFile} but the upload says ${chuckTemperatureK}` });
    else chuckTemperatureK = inFile;
  }
  if (!lot) problems.push({ field: "lot", line: null, message: "no lot number: give it as `# lot:` in the file or as the `lot` field" });
  if (!product) problems.push({ field: "product", line: null, message: "no product: give it as `# product:` in the file or as the `product` field" });
  if (problems.length) {
    const first = problems[0]!;
    throw new AppError("unprocessable", `${first.line ? `line ${first.line}: ` : ""}${first.message}`, problems);
  }
  return { lot: lot!, product: product!, chuckTemperatureK };
}

function metadataLineFinder(head: Buffer): (key: string) => number | null {
  const lines = head.toString("utf8").split("\n");
  return (key) => {
    const index = lines.findIndex((l) => new RegExp(`^\\uFEFF?#\\s*${key}\\s*:`, "i").test(l));
    return index >= 0 ? index + 1 : null;
  };
}

/**
 * Takes an upload into the object store and queues its ingest job (`declaredBytes`: the body's length when the
 * request states it). The same bytes again answer the first job
 * (created: false). Header problems and lot/product disagreements are refused here, before anything is queued.
 */
export async function enqueueIngest(scope: Scope, body: Readable, fileName: string | null, fields: IngestFields, declaredBytes: number | null = null): Promise<{ job: JobView; created: boolean }> {
  const stored = await streamToObjectStore(scope.tenantId, body, env.MAX_UPLOAD_BYTES, declaredBytes);
  try {
    const existing = await withScope(scope, async (tx) => {
      const file = await tx.selectFrom("raw_files").select("id").where("sha256", "=", stored.sha256).executeTakeFirst();
      return file ? findJobForFile(tx, file.id) : null;
    });
    if (existing) {
      await deleteObject(stored.temporaryKey);
      return { job: existing, created: false };
    }
    let header: ProbeFileHeader | null;
    try {
      header = await readHead(stored.head);
    } catch (error) {
      if (error instanceof ProbeFileError) throw new AppError("unprocessable", error.message, [{ line: error.line, code: error.code, message: error.message }]);
      throw error;
    }
    const resolved = reconcileFields(header?.metadata ?? {}, fields, metadataLineFinder(stored.head));
    if (resolved.chuckTemperatureK === null) {
      throw new AppError("unprocessable", "no chuck temperature: give `# chuck_temperature_k:` in the file or the `chuck_temperature_k` field");
    }
    const product = await withScope(scope, (tx) => findProduct(tx, resolved.product));
    if (!product) throw new AppError("unprocessable", `unknown product "${resolved.product}": create it first (Products)`, [{ field: "product", message: "unknown product" }]);

    const finalKey = rawFileKey(scope.tenantId, stored.sha256);
    await promoteUpload(stored.temporaryKey, finalKey);
    const jobId = await withScope(scope, async (tx) => {
      const file = await tx
        .insertInto("raw_files")
        .values({ tenant_id: scope.tenantId, sha256: stored.sha256, size_bytes: stored.sizeBytes, object_key: finalKey, file_name: fileName, uploaded_by: scope.actorLabel })
        .onConflict((oc) => oc.columns(["tenant_id", "sha256"]).doNothing())
        .returning("id")
        .executeTakeFirst();
      if (!file) return null; // the same bytes arrived concurrently: answer with that upload's job below
      const job = await tx
        .insertInto("ingest_jobs")
        .values({ tenant_id: scope.tenantId, raw_file_id: file.id, lot_number: resolved.lot, product_code: resolved.product, chuck_temperature_k: resolved.chuckTemperatureK, created_by: scope.actorLabel })
        .returning("id")
        .executeTakeFirstOrThrow();
      return job.id;
    });
    if (!jobId) {
      const raced = await withScope(scope, async (tx) => {
        const file = await tx.selectFrom("raw_files").select("id").where("sha256", "=", stored.sha256).executeTakeFirstOrThrow();
        return findJobForFile(tx, file.id);
      });
      return { job: raced!, created: false };
    }
    return { job: await withScope(scope, (tx) => getJob(tx, jobId)), created: true };
  } catch (error) {
    await deleteObject(stored.temporaryKey);
    throw error;
  }
}
