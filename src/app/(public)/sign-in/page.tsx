import type { Metadata } from "next";

export const metadata: Metadata = { title: "Sign in" };

export default function SignInPage() {
  return (
    <main className="flex min-h-screen items-center justify-center bg-slate-wash px-4">
      <div className="w-full max-w-sm rounded-lg border border-slate-line bg-slate-panel p-8 shadow-sm">
        <p className="text-xs font-semibold uppercase tracking-[0.2em] text-ink-muted">Lotwarden</p>
        <h1 className="mt-2 text-2xl font-semibold text-ink">Sign in</h1>
        <form className="mt-6 space-y-4">
          <label className="block text-sm font-medium text-ink-soft">
            E-mail
            <input name="email" type="email" autoComplete="username" required className="mt-1 block w-full rounded border border-slate-line px-3 py-2 text-ink focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30" />
          </label>
          <label className="block text-sm font-medium text-ink-soft">
            Password
            <input name="password" type="password" autoComplete="current-password" required className="mt-1 block w-full rounded border border-slate-line px-3 py-2 text-ink focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30" />
          </label>
          <button type="submit" className="w-full rounded bg-accent px-4 py-2 font-medium text-white hover:bg-accent-strong">
            Sign in
          </button>
        </form>
      </div>
    </main>
  );
}
