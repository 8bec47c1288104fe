"use client";

import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import type { SavedView } from "@/lib/schemas/views";
import { deleteViewAction, saveViewAction } from "./view-actions";

/** Save the page as it is now (wafer, colouring, selected die: all in the URL) under a name, and reopen it later. */
export function SavedViews({ views }: { views: SavedView[] }) {
  const pathname = usePathname();
  const params = useSearchParams();
  const router = useRouter();
  const [name, setName] = useState("");
  const [message, setMessage] = useState<string | null>(null);
  const [pending, start] = useTransition();
  return (
    <details className="relative text-sm">
      <summary className="cursor-pointer rounded border border-slate-line bg-slate-panel px-3 py-1.5 hover:bg-slate-wash">Saved views ({views.length})</summary>
      <div className="absolute right-0 z-20 mt-1 w-80 rounded border border-slate-line bg-slate-panel p-3 shadow-lg">
        <form
          className="flex gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            start(async () => {
              const result = await saveViewAction({ name, path: pathname, query: params.toString() });
              setMessage(result.ok ? `Saved “${result.data.name}”.` : result.message);
              if (result.ok) {
                setName("");
                router.refresh();
              }
            });
          }}
        >
          <input aria-label="Name of the view" className="min-w-0 flex-1 rounded border border-slate-line px-2 py-1" placeholder="e.g. W3 shorts" value={name} onChange={(e) => setName(e.target.value)} />
          <Button type="submit" disabled={pending || !name.trim()}>Save</Button>
        </form>
        {message ? <p role="status" className="mt-2 text-xs text-ink-soft">{message}</p> : null}
        <ul className="mt-2 divide-y divide-slate-line">
          {views.map((v) => (
            <li key={v.id} className="flex items-center justify-between gap-2 py-1.5">
              <Link className="truncate text-accent underline-offset-2 hover:underline" href={v.href}>{v.name}</Link>
              <button type="button" className="text-xs text-ink-muted hover:text-alert" onClick={() => start(async () => { await deleteViewAction({ viewId: v.id }); router.refresh(); })}>Delete</button>
            </li>
          ))}
        </ul>
      </div>
    </details>
  );
}
