// The local SMTP fake: accepts every message on 127.0.0.1, keeps each one as a JSON file, and serves them on a
// small HTTP API (GET /messages, GET /messages/<id>, DELETE /messages) for the development outbox page and tests.
// Usage: node --import tsx src/cli/smtp-fake.ts <smtp port> <http port> <directory>
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import http from "node:http";
import path from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

const [smtpPortArg, httpPortArg, directoryArg] = process.argv.slice(2);
if (!smtpPortArg || !httpPortArg || !directoryArg) {
  process.stderr.write("usage: smtp-fake.ts <smtp port> <http port> <directory>\n");
  process.exit(2);
}
const directory: string = directoryArg;
mkdirSync(directory, { recursive: true });

let sequence = Date.now();

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  size: 25 * 1024 * 1024,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const id = `${++sequence}`;
        const addresses = (value: typeof mail.to) =>
          (Array.isArray(value) ? value : value ? [value] : []).flatMap((a) => a.value.map((v) => v.address ?? ""));
        const message = {
          id,
          receivedAt: new Date().toISOString(),
          envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
          envelopeTo: session.envelope.rcptTo.map((r) => r.address),
          from: mail.from?.text ?? "",
          to: addresses(mail.to),
          subject: mail.subject ?? "",
          text: mail.text ?? "",
          html: typeof mail.html === "string" ? mail.html : "",
          attachments: mail.attachments.map((a) => ({ filename: a.filename ?? null, contentType: a.contentType, size: a.size })),
        };
        writeFileSync(path.join(directory, `${id}.json`), JSON.stringify(message));
        callback();
      })
      .catch((error: Error) => callback(error));
  },
});

function listMessages(): unknown[] {
  return readdirSync(directory)
    .filter((f) => f.endsWith(".json"))
    .sort()
    .reverse()
    .map((f) => JSON.parse(readFileSync(path.join(directory, f), "utf8")));
}

const api = http.createServer((req, res) => {
  const url = new URL(req.url ?? "/", "http://127.0.0.1");
  const send = (status: number, body: unknown) => {
    res.writeHead(status, { "content-type": "application/json" });
    res.end(JSON.stringify(body));
  };
  if (req.method === "GET" && url.pathname === "/messages") return send(200, { messages: listMessages() });
  const one = url.pathname.match(/^\/messages\/(\d+)$/);
  if (req.method === "GET" && one) {
    const file = path.join(directory, `${one[1]}.json`);
    try {
      return send(200, JSON.parse(readFileSync(file, "utf8")));
    } catch {
      return send(404, { error: "no such message" });
    }
  }
  if (req.method === "DELETE" && url.pathname === "/messages") {
    for (const f of readdirSync(directory)) rmSync(path.join(directory, f), { force: true });
    return send(200, { deleted: true });
  }
  if (req.method === "GET" && url.pathname === "/health") return send(200, { ok: true });
  send(404, { error: "not found" });
});

smtp.listen(Number(smtpPortArg), "127.0.0.1", () => {
  api.listen(Number(httpPortArg), "127.0.0.1", () => {
    process.stdout.write(`smtp fake on 127.0.0.1:${smtpPortArg}, messages at http://127.0.0.1:${httpPortArg}/messages\n`);
  });
});
smtp.on("error", (error) => process.stderr.write(`smtp fake error: ${String(error)}\n`));
for (const signal of ["SIGTERM", "SIGINT"] as const) {
  process.on(signal, () => {
    api.close();
    smtp.close(() => process.exit(0));
  });
}
