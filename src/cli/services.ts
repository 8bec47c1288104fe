// Starts (or reuses) the local services of a profile and returns the environment the app and tests run with.
// Any of them can be replaced by a real one: DATABASE_URL (+ MIGRATION_DATABASE_URL), S3_ENDPOINT, SMTP_URL.
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { CreateBucketCommand, HeadBucketCommand, S3Client } from "@aws-sdk/client-s3";
import { startPostgres, stopPostgres } from "./postgres";
import { log, portInUse, runningRecorded, SetupError, startDetached, stopRecorded, waitForPort } from "./processes";
import { projectRoot, type Profile } from "./profile";

const S3_ACCESS_KEY = "S3RVER"; // the fake's fixed credentials (s3rver's defaults)
const S3_SECRET_KEY = "S3RVER";

function stableSecret(profile: Profile, name: string): string {
  const file = path.join(profile.dataDir, "secrets.json");
  const secrets: Record<string, string> = existsSync(file) ? JSON.parse(readFileSync(file, "utf8")) : {};
  if (!secrets[name]) {
    secrets[name] = randomBytes(24).toString("base64url");
    mkdirSync(profile.dataDir, { recursive: true });
    writeFileSync(file, JSON.stringify(secrets), { mode: 0o600 });
  }
  return secrets[name]!;
}

async function startTsProcess(profile: Profile, name: string, port: number, script: string, args: string[]): Promise<void> {
  if (runningRecorded(profile.dataDir, name)) {
    log(`${name} already running on 127.0.0.1:${port}`);
    return;
  }
  if (await portInUse(port)) {
    throw new SetupError(`port ${port} (for the ${name}) is taken by another program. Stop it or set a different port (see README, "Configuration").`);
  }
  const started = startDetached(profile.dataDir, name, process.execPath, ["--import", "tsx", path.join(projectRoot, "src/cli", script), ...args], process.env, projectRoot);
  await waitForPort(port, name, 30_000, started.pid);
  log(`${name} is up on 127.0.0.1:${port}`);
}

async function ensureBucket(env: Record<string, string>): Promise<void> {
  const s3 = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: true,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID!, secretAccessKey: env.S3_SECRET_ACCESS_KEY! },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  try {
    await s3.send(new HeadBucketCommand({ Bucket: env.S3_BUCKET }));
  } catch {
    await s3.send(new CreateBucketCommand({ Bucket: env.S3_BUCKET }));
    log(`created bucket ${env.S3_BUCKET}`);
  } finally {
    s3.destroy();
  }
}

export async function startServices(profile: Profile): Promise<Record<string, string>> {
  mkdirSync(profile.dataDir, { recursive: true });
  const env: Record<string, string> = {
    NODE_ENV: "production",
    LOTWARDEN_PROFILE: profile.name,
    APP_URL: process.env.APP_URL ?? `http://127.0.0.1:${profile.appPort}`,
    WORKER_SECRET: process.env.WORKER_SECRET ?? stableSecret(profile, "worker"),
    S3_REGION: process.env.S3_REGION ?? "us-east-1",
    S3_BUCKET: process.env.S3_BUCKET ?? "lotwarden-raw",
    MAIL_FROM: process.env.MAIL_FROM ?? "Lotwarden <no-reply@lotwarden.local>",
  };

  if (process.env.DATABASE_URL) {
    env.DATABASE_URL = process.env.DATABASE_URL;
    env.MIGRATION_DATABASE_URL = process.env.MIGRATION_DATABASE_URL ?? process.env.DATABASE_URL;
  } else {
    const urls = await startPostgres(profile);
    env.DATABASE_URL = urls.appUrl;
    env.MIGRATION_DATABASE_URL = urls.ownerUrl;
  }

  if (process.env.S3_ENDPOINT) {
    env.S3_ENDPOINT = process.env.S3_ENDPOINT;
    env.S3_ACCESS_KEY_ID = process.env.S3_ACCESS_KEY_ID ?? "";
    env.S3_SECRET_ACCESS_KEY = process.env.S3_SECRET_ACCESS_KEY ?? "";
  } else {
    const dir = path.join(profile.dataDir, "s3");
    mkdirSync(dir, { recursive: true });
    await startTsProcess(profile, "s3-fake", profile.s3Port, "s3-fake.ts", [String(profile.s3Port), dir]);
    env.S3_ENDPOINT = `http://127.0.0.1:${profile.s3Port}`;
    env.S3_ACCESS_KEY_ID = S3_ACCESS_KEY;
    env.S3_SECRET_ACCESS_KEY = S3_SECRET_KEY;
  }
  await ensureBucket(env);

  if (process.env.SMTP_URL) {
    env.SMTP_URL = process.env.SMTP_URL;
  } else {
    const dir = path.join(profile.dataDir, "mail");
    await startTsProcess(profile, "smtp-fake", profile.smtpPort, "smtp-fake.ts", [String(profile.smtpPort), String(profile.mailApiPort), dir]);
    await waitForPort(profile.mailApiPort, "smtp fake mailbox API");
    env.SMTP_URL = `smtp://127.0.0.1:${profile.smtpPort}`;
    env.MAIL_FAKE_URL = `http://127.0.0.1:${profile.mailApiPort}`;
  }

  writeFileSync(path.join(profile.dataDir, "env.json"), JSON.stringify(env, null, 2), { mode: 0o600 });
  return env;
}

/** The environment written by the last start of a profile, for `npm run db:migrate` and friends. */
export function savedEnv(profile: Profile): Record<string, string> | null {
  const file = path.join(profile.dataDir, "env.json");
  return existsSync(file) ? JSON.parse(readFileSync(file, "utf8")) : null;
}

export async function stopServices(profile: Profile): Promise<string[]> {
  const stopped: string[] = [];
  for (const name of ["worker", "app", "smtp-fake", "s3-fake"]) {
    if (await stopRecorded(profile.dataDir, name)) stopped.push(name);
  }
  if (!process.env.DATABASE_URL && stopPostgres(profile)) stopped.push("postgresql");
  return stopped;
}
