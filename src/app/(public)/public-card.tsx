import type { ReactNode } from "react";

/** The frame of the pages that need no session: sign-in, invitations, password reset. */
export function PublicCard({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center bg-slate-wash px-4 py-10">
      <div className="w-full max-w-sm rounded-lg border border-slate-line bg-slate-panel p-8 shadow-sm">
        <p className="text-xs font-semibold uppercase tracking-[0.2em] text-ink-muted">Lotwarden</p>
        <h1 className="mt-2 text-2xl font-semibold text-ink">{title}</h1>
        {children}
      </div>
    </main>
  );
}
