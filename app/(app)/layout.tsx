import { redirect } from "next/navigation";
import { AppShell } from "@/components/layout/AppShell";
import { currentUser } from "@/lib/auth/session";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  // The proxy already sends signed-out visitors away; this check does not rely on it.
  const user = await currentUser();
  if (!user) redirect("/signin");
  return <AppShell user={user}>{children}</AppShell>;
}
