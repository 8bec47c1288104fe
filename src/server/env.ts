import "server-only";
import { z } from "zod";

// The one reader of process.env. A missing or malformed variable stops the process with its name.
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.string().url(),
  APP_URL: z.string().url().default("http://127.0.0.1:3000"),
  WORKER_SECRET: z.string().min(16, "WORKER_SECRET must be at least 16 characters"),
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().default("us-east-1"),
  S3_BUCKET: z.string().min(3),
  S3_ACCESS_KEY_ID: z.string().min(1),
  S3_SECRET_ACCESS_KEY: z.string().min(1),
  SMTP_URL: z.string().url(),
  MAIL_FROM: z.string().default("Lotwarden <no-reply@lotwarden.local>"),
  MAIL_FAKE_URL: z.string().url().optional(),
  LOTWARDEN_PROFILE: z.enum(["dev", "test"]).optional(),
  /** Largest probe file accepted, in bytes (default 4 GiB). */
  MAX_UPLOAD_BYTES: z.coerce.number().int().positive().default(4 * 1024 ** 3),
  /** Smallest segment of COPY bytes an ingest job hands PostgreSQL at a time (default 4 MiB; the tests use less). */
  INGEST_SEGMENT_BYTES: z.coerce.number().int().min(1024).default(4 * 1024 ** 2),
});

export type Env = z.infer<typeof envSchema>;

function parseEnv(): Env {
  const result = envSchema.safeParse(process.env);
  if (!result.success) {
    const problems = result.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
    throw new Error(`Lotwarden configuration is invalid: ${problems}. See README, "Configuration".`);
  }
  return result.data;
}

export const env: Env = parseEnv();
