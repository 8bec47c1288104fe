import type { Metadata } from "next";
import Link from "next/link";
import { ROLE_LABELS } from "@/lib/permissions";
import { findInvitation } from "@/server/auth/invitations";
import { PublicCard } from "../../public-card";
import { AcceptForm } from "./accept-form";

export const metadata: Metadata = { title: "Accept invitation" };
export const dynamic = "force-dynamic";

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = token.length >= 20 && token.length <= 200 ? await findInvitation(token) : null;
  if (!invitation) {
    return (
      <PublicCard title="Invitation not valid">
        <p className="mt-4 text-sm text-ink-soft">This link was already used, was withdrawn, or has expired. Ask your admin for a new invitation.</p>
        <Link href="/sign-in" className="mt-4 inline-block text-sm text-accent underline">Go to sign-in</Link>
      </PublicCard>
    );
  }
  return (
    <PublicCard title={`Join ${invitation.tenantName}`}>
      <p className="mt-3 text-sm text-ink-soft">You are invited as {ROLE_LABELS[invitation.role].toLowerCase()}.</p>
      <AcceptForm token={token} email={invitation.email} existingUser={invitation.existingUser} />
    </PublicCard>
  );
}
