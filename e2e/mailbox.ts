// Reads the messages the local SMTP fake captured, as a person would read their inbox.
export interface CapturedMessage {
  id: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

const mailUrl = () => {
  const url = process.env.MAIL_FAKE_URL;
  if (!url) throw new Error("MAIL_FAKE_URL is not set: run the browser tests with `npm test`");
  return url;
};

export async function waitForMessage(to: string, subjectIncludes: string, timeoutMs = 15_000): Promise<CapturedMessage> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const { messages } = (await (await fetch(`${mailUrl()}/messages`)).json()) as { messages: CapturedMessage[] };
    const found = messages.find((m) => m.to.includes(to) && m.subject.includes(subjectIncludes));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no message to ${to} with "${subjectIncludes}" within ${timeoutMs} ms`);
}

export function firstLink(message: CapturedMessage, pathPrefix: string): string {
  const match = message.text.match(new RegExp(`https?://\\S+${pathPrefix}\\S+`));
  if (!match) throw new Error(`no ${pathPrefix} link in "${message.subject}"`);
  return match[0];
}
