import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { getAuthContext } from "@/server/auth/context";
import { PublicCard } from "../public-card";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };
export const dynamic = "force-dynamic";

export default async function SignInPage() {
  if (await getAuthContext()) redirect("/");
  return (
    <PublicCard title="Sign in">
      <SignInForm />
      <p className="mt-4 text-sm">
        <Link href="/reset" className="text-accent underline-offset-2 hover:underline">Forgot your password?</Link>
      </p>
    </PublicCard>
  );
}
