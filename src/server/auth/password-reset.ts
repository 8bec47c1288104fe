import "server-only";
import { sql } from "kysely";
import { withGlobal } from "../db/scope";
import { AppError } from "../http/errors";
import { enqueueEmail, kickMailer } from "../mail/outbox";
import { linkMessage } from "../mail/templates";
import { hashPassword, newToken, sha256 } from "./secrets";
import { createSession, type CookieSpec, invalidateUserSessions } from "./session";

export const RESET_HOURS = 2;

/** Queues a reset link when the e-mail belongs to a user; answers the same either way, so nobody learns who exists. */
export async function requestPasswordReset(email: string): Promise<void> {
  const token = newToken();
  await withGlobal(async (tx) => {
    const user = await tx.selectFrom("users").select(["id", "email"]).where(sql`lower(email)`, "=", email.toLowerCase()).executeTakeFirst();
    if (!user) return;
    await tx.insertInto("password_resets").values({ user_id: user.id, token_hash: sha256(token), expires_at: new Date(Date.now() + RESET_HOURS * 3_600_000) }).execute();
    const message = linkMessage(
      ["Someone asked to reset the password of your Lotwarden account.", `If it was you, choose a new password within ${RESET_HOURS} hours. If not, ignore this message.`],
      { label: "Choose a new password", path: `/reset/${token}` },
    );
    await enqueueEmail(tx, { tenantId: null, kind: "password_reset", to: user.email, subject: "Reset your Lotwarden password", ...message });
  });
  kickMailer();
}

export async function resetTokenIsValid(token: string): Promise<boolean> {
  const row = await withGlobal((tx) =>
    tx.selectFrom("password_resets").select(["expires_at", "used_at"]).where("token_hash", "=", sha256(token)).executeTakeFirst(),
  );
  return Boolean(row && !row.used_at && row.expires_at.getTime() > Date.now());
}

/** Sets the new password, uses up the token, signs the user out everywhere, and starts one fresh session. */
export async function resetPassword(token: string, password: string): Promise<CookieSpec> {
  const passwordHash = await hashPassword(password);
  const userId = await withGlobal(async (tx) => {
    const reset = await tx
      .updateTable("password_resets")
      .set({ used_at: new Date() })
      .where("token_hash", "=", sha256(token))
      .where("used_at", "is", null)
      .where("expires_at", ">", new Date())
      .returning("user_id")
      .executeTakeFirst();
    if (!reset) throw new AppError("not_found", "This reset link is not valid any more: ask for a new one.");
    await tx.updateTable("users").set({ password_hash: passwordHash, password_changed_at: new Date() }).where("id", "=", reset.user_id).execute();
    await tx.insertInto("security_events").values({ kind: "password_reset", user_id: reset.user_id, success: true }).execute();
    return reset.user_id;
  });
  await invalidateUserSessions(userId);
  return createSession(userId, null);
}
