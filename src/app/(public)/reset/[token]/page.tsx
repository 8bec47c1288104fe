import type { Metadata } from "next";
import Link from "next/link";
import { resetTokenIsValid } from "@/server/auth/password-reset";
import { PublicCard } from "../../public-card";
import { NewPasswordForm } from "../reset-forms";

export const metadata: Metadata = { title: "Choose a new password" };
export const dynamic = "force-dynamic";

export default async function ResetPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  if (token.length < 20 || token.length > 200 || !(await resetTokenIsValid(token))) {
    return (
      <PublicCard title="Link not valid">
        <p className="mt-4 text-sm text-ink-soft">This reset link was used or has expired.</p>
        <Link href="/reset" className="mt-4 inline-block text-sm text-accent underline">Ask for a new one</Link>
      </PublicCard>
    );
  }
  return (
    <PublicCard title="Choose a new password">
      <NewPasswordForm token={token} />
    </PublicCard>
  );
}
