import type { Metadata } from "next";
import { Panel, PageHeader } from "@/components/ui/page-header";
import { ROLE_LABELS } from "@/lib/permissions";
import { requireContext } from "@/server/auth/context";

export const metadata: Metadata = { title: "Home" };

export default async function HomePage() {
  const context = await requireContext();
  return (
    <>
      <PageHeader eyebrow={context.tenantName} title={`Welcome, ${context.user?.name ?? ""}`} />
      <Panel>
        <p className="text-sm text-ink-soft">
          You are signed in to {context.tenantName} as {ROLE_LABELS[context.role].toLowerCase()}.
        </p>
      </Panel>
    </>
  );
}
