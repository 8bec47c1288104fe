import type { Metadata } from "next";
import { PublicCard } from "../public-card";
import { RequestResetForm } from "./reset-forms";

export const metadata: Metadata = { title: "Reset password" };

export default function RequestResetPage() {
  return (
    <PublicCard title="Reset your password">
      <RequestResetForm />
    </PublicCard>
  );
}
