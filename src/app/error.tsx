"use client";

export default function ErrorPage({ reset }: { error: Error; reset: () => void }) {
  return (
    <main className="mx-auto max-w-xl px-6 py-24">
      <h1 className="text-2xl font-semibold">Something went wrong</h1>
      <p className="mt-3 text-ink-soft">The page could not be shown. Nothing you entered was lost; try again.</p>
      <button type="button" onClick={reset} className="mt-6 rounded bg-accent px-4 py-2 text-white hover:bg-accent-strong">
        Try again
      </button>
    </main>
  );
}
