import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { listCapturedMail } from "@/server/mail/outbox-fake";

export const metadata: Metadata = { title: "Development outbox" };
export const dynamic = "force-dynamic";

export default async function OutboxPage() {
  const messages = await listCapturedMail();
  if (messages === null) notFound(); // only where the local SMTP fake runs
  return (
    <main className="mx-auto max-w-5xl px-6 py-10">
      <p className="text-xs font-semibold uppercase tracking-[0.2em] text-ink-muted">Development only</p>
      <h1 className="mt-1 text-2xl font-semibold">Outbox</h1>
      <p className="mt-2 text-sm text-ink-soft">Every message the local SMTP fake captured, newest first. Nothing here left this machine.</p>
      {messages.length === 0 ? (
        <p className="mt-8 rounded border border-dashed border-slate-line bg-slate-panel p-6 text-ink-soft">No e-mail has been sent yet.</p>
      ) : (
        <ul className="mt-6 space-y-4">
          {messages.map((m) => (
            <li key={m.id} className="rounded border border-slate-line bg-slate-panel p-4">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <h2 className="font-medium">{m.subject || "(no subject)"}</h2>
                <time className="tabular text-xs text-ink-muted" dateTime={m.receivedAt}>{new Date(m.receivedAt).toLocaleString("en-GB", { timeZone: "UTC" })} UTC</time>
              </div>
              <p className="mt-1 text-sm text-ink-soft">To {m.to.join(", ")} · from {m.from}</p>
              <pre className="mt-3 whitespace-pre-wrap break-words font-sans text-sm text-ink">{m.text}</pre>
            </li>
          ))}
        </ul>
      )}
    </main>
  );
}
