import type { Metadata } from "next";
import { notFound, redirect } from "next/navigation";
import { NotificationSettingsForm } from "@/components/settings/NotificationSettingsForm";
import { can } from "@/lib/auth/permissions";
import { currentUser } from "@/lib/auth/session";
import { notificationPreferencesFor } from "@/lib/data/notification-settings";

export const metadata: Metadata = { title: "Settings" };
export const dynamic = "force-dynamic";

export default async function SettingsPage() {
  const user = await currentUser();
  if (!user) redirect("/signin");
  if (!can(user.role, "notifications:manage-own")) notFound();
  const preferences = await notificationPreferencesFor(user.id);
  return (
    <section>
      <h1 className="text-2xl font-semibold">Settings</h1>
      <p className="mb-4 text-soil-700">Notices go to {user.email}. Invitations and password links always arrive, whatever you choose here.</p>
      <NotificationSettingsForm initial={preferences} />
    </section>
  );
}
