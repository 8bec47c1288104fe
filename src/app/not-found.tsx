import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-6 py-24">
      <p className="text-sm font-medium uppercase tracking-wide text-ink-muted">404</p>
      <h1 className="mt-2 text-2xl font-semibold">Nothing here</h1>
      <p className="mt-3 text-ink-soft">This page does not exist, or it is not yours to see.</p>
      <Link href="/" className="mt-6 inline-block text-accent underline">Back to Lotwarden</Link>
    </main>
  );
}
