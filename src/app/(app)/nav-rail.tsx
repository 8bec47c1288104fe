"use client";

import Link from "next/link";
import { usePathname, useRouter } from "next/navigation";
import { useTransition } from "react";
import { signOutAction, switchTenantAction } from "./actions";

export interface NavItem {
  href: string;
  label: string;
}

interface Props {
  items: NavItem[];
  tenants: { id: string; name: string }[];
  tenantId: string;
  userName: string;
  roleLabel: string;
}

export function NavRail({ items, tenants, tenantId, userName, roleLabel }: Props) {
  const pathname = usePathname();
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const current = tenants.find((t) => t.id === tenantId);
  return (
    <nav aria-label="Main" className="flex h-full w-60 shrink-0 flex-col bg-slate-rail text-slate-200">
      <div className="border-b border-white/10 p-4">
        <p className="text-[11px] font-semibold uppercase tracking-[0.22em] text-slate-400">Lotwarden</p>
        {tenants.length > 1 ? (
          <label className="mt-2 block text-xs text-slate-400">
            Tenant
            <select
              aria-label="Switch tenant"
              className="mt-1 block w-full rounded border border-white/15 bg-white/5 px-2 py-1.5 text-sm text-white focus:outline-none focus-visible:ring-2 focus-visible:ring-white/40"
              value={tenantId}
              disabled={pending}
              onChange={(e) =>
                startTransition(async () => {
                  const result = await switchTenantAction({ tenantId: e.target.value });
                  if (result.ok) {
                    router.push("/");
                    router.refresh();
                  }
                })
              }
            >
              {tenants.map((t) => (
                <option key={t.id} value={t.id} className="text-ink">
                  {t.name}
                </option>
              ))}
            </select>
          </label>
        ) : (
          <p className="mt-2 text-sm font-medium text-white">{current?.name}</p>
        )}
      </div>
      <ul className="flex-1 space-y-0.5 p-2">
        {items.map((item) => {
          const active = item.href === "/" ? pathname === "/" : pathname.startsWith(item.href);
          return (
            <li key={item.href}>
              <Link
                href={item.href}
                aria-current={active ? "page" : undefined}
                className={`block rounded px-3 py-2 text-sm focus:outline-none focus-visible:ring-2 focus-visible:ring-white/40 ${active ? "bg-white/12 font-medium text-white" : "text-slate-300 hover:bg-white/5 hover:text-white"}`}
              >
                {item.label}
              </Link>
            </li>
          );
        })}
      </ul>
      <div className="border-t border-white/10 p-4 text-sm">
        <p className="font-medium text-white">{userName}</p>
        <p className="text-xs text-slate-400">{roleLabel}</p>
        <button
          type="button"
          className="mt-3 text-xs text-slate-300 underline-offset-2 hover:text-white hover:underline"
          onClick={() =>
            startTransition(async () => {
              const result = await signOutAction({});
              router.replace(result.ok ? result.data.next : "/sign-in");
              router.refresh();
            })
          }
        >
          Sign out
        </button>
      </div>
    </nav>
  );
}
