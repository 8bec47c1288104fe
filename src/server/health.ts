import "server-only";
import { HeadBucketCommand } from "@aws-sdk/client-s3";
import { sql } from "kysely";
import { db } from "./db/client";
import { mailTransport } from "./mail/transport";
import { bucket, s3 } from "./storage/s3";

export type ServiceState = { status: "up" } | { status: "down"; reason: string };

async function probe(check: () => Promise<unknown>, timeoutMs = 3000): Promise<ServiceState> {
  try {
    await Promise.race([
      check(),
      new Promise((_, reject) => setTimeout(() => reject(new Error(`no answer within ${timeoutMs} ms`)), timeoutMs)),
    ]);
    return { status: "up" };
  } catch (error) {
    // Only a short reason: no URLs, hosts or credentials leave the server.
    const reason = error instanceof Error ? error.name === "Error" ? error.message.split("\n")[0]! : error.name : "unreachable";
    return { status: "down", reason: reason.replace(/\w+:\/\/\S+/g, "<url>").slice(0, 120) };
  }
}

export async function checkHealth() {
  const [database, objectStore, mailRelay] = await Promise.all([
    probe(() => sql`select 1`.execute(db)),
    probe(() => s3.send(new HeadBucketCommand({ Bucket: bucket }))),
    probe(() => mailTransport.verify()),
  ]);
  const ok = [database, objectStore, mailRelay].every((s) => s.status === "up");
  return { status: ok ? "ok" : "degraded", services: { database, objectStore, mailRelay } } as const;
}
