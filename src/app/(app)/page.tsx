import type { Metadata } from "next";
import { requireContext } from "@/server/auth/context";
import { CustomerHome } from "./customer-home";
import { StaffHome } from "./staff-home";

export const metadata: Metadata = { title: "Home" };

export default async function HomePage() {
  const context = await requireContext();
  return context.role === "customer" ? <CustomerHome context={context} /> : <StaffHome context={context} />;
}
