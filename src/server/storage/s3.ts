import "server-only";
import { S3Client } from "@aws-sdk/client-s3";
import { env } from "../env";

// Checksums only when an operation requires them: with the SDK's default, streamed uploads are sent with
// aws-chunked framing that S3-compatible fakes store verbatim as the object's bytes.
export const s3 = new S3Client({
  endpoint: env.S3_ENDPOINT,
  region: env.S3_REGION,
  forcePathStyle: Boolean(env.S3_ENDPOINT),
  credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
  requestChecksumCalculation: "WHEN_REQUIRED",
  responseChecksumValidation: "WHEN_REQUIRED",
});

export const bucket = env.S3_BUCKET;
