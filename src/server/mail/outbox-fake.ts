import "server-only";
import { z } from "zod";
import { env } from "../env";

const capturedSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
});
export type CapturedMail = z.infer<typeof capturedSchema>;

/** Messages captured by the local SMTP fake, or null where no fake runs (a real relay is configured). */
export async function listCapturedMail(): Promise<CapturedMail[] | null> {
  if (!env.MAIL_FAKE_URL) return null;
  const response = await fetch(`${env.MAIL_FAKE_URL}/messages`, { cache: "no-store" });
  if (!response.ok) throw new Error(`mail fake answered ${response.status}`);
  const body = z.object({ messages: z.array(capturedSchema) }).parse(await response.json());
  return body.messages;
}
