import "server-only";
import type { Kysely } from "kysely";
import { sql } from "kysely";
import { withMailSender } from "../db/scope";
import type { Database } from "../db/schema";
import { mailTransport } from "./transport";

export interface OutgoingEmail {
  tenantId: string | null;
  kind: string;
  to: string;
  subject: string;
  text: string;
  html?: string;
}

/** Writes e-mail to the outbox in the caller's transaction: the event and its mail commit together or not at all. */
export async function enqueueEmail(tx: Kysely<Database>, emails: OutgoingEmail | OutgoingEmail[]): Promise<void> {
  const list = Array.isArray(emails) ? emails : [emails];
  if (list.length === 0) return;
  await tx
    .insertInto("outbound_emails")
    .values(list.map((e) => ({ tenant_id: e.tenantId, kind: e.kind, to_address: e.to, subject: e.subject, text_body: e.text, html_body: e.html ?? null })))
    .execute();
}

export const MAX_ATTEMPTS = 12;

/** Back-off after the n-th failed attempt: 30 s doubling, at most an hour. */
export function retryDelaySeconds(attempts: number): number {
  return Math.min(3600, 30 * 2 ** Math.max(0, attempts - 1));
}

/**
 * Sends due outbox messages. Rows are claimed with FOR UPDATE SKIP LOCKED so two senders never send one message;
 * a relay that is down leaves them pending with a later attempt time, never lost.
 */
export async function deliverPendingEmail(limit = 20): Promise<{ sent: number; failed: number }> {
  return withMailSender(async (tx) => {
    const due = await tx
      .selectFrom("outbound_emails")
      .selectAll()
      .where("status", "=", "pending")
      .where("next_attempt_at", "<=", sql<Date>`now()`)
      .orderBy("id")
      .limit(limit)
      .forUpdate()
      .skipLocked()
      .execute();
    let sent = 0;
    let failed = 0;
    for (const message of due) {
      try {
        await mailTransport.sendMail({ to: message.to_address, subject: message.subject, text: message.text_body, html: message.html_body ?? undefined });
        await tx.updateTable("outbound_emails").set({ status: "sent", sent_at: new Date(), attempts: message.attempts + 1, last_error: null }).where("id", "=", message.id).execute();
        sent++;
      } catch (error) {
        const attempts = message.attempts + 1;
        await tx
          .updateTable("outbound_emails")
          .set({
            attempts,
            last_error: error instanceof Error ? error.message.slice(0, 500) : String(error),
            status: attempts >= MAX_ATTEMPTS ? "failed" : "pending",
            next_attempt_at: new Date(Date.now() + retryDelaySeconds(attempts) * 1000),
          })
          .where("id", "=", message.id)
          .execute();
        failed++;
        if (isConnectionError(error)) break; // the relay is down: leave the rest for the next round
      }
    }
    return { sent, failed };
  });
}

function isConnectionError(error: unknown): boolean {
  const code = (error as { code?: string } | null)?.code;
  return code === "ECONNECTION" || code === "ESOCKET" || code === "ETIMEDOUT" || code === "ECONNREFUSED";
}

/** Tries to send right away after a commit; the worker's regular round picks up whatever this misses. */
export function kickMailer(): void {
  void deliverPendingEmail().catch(() => undefined);
}
