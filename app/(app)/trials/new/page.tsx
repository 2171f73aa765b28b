import type { Metadata } from "next";
import { notFound, redirect } from "next/navigation";
import { BasicsStep } from "@/components/wizard/BasicsStep";
import { WizardNav } from "@/components/wizard/WizardNav";
import { can } from "@/lib/auth/permissions";
import { currentUser } from "@/lib/auth/session";
import { listSites } from "@/lib/data/sites";

export const metadata: Metadata = { title: "New trial" };
export const dynamic = "force-dynamic";

export default async function NewTrialPage() {
  const user = await currentUser();
  if (!user) redirect("/signin");
  if (!can(user.role, "trial:create")) notFound();
  const sites = await listSites();
  return (
    <section>
      <h1 className="mb-1 text-2xl font-semibold">New trial</h1>
      <p className="mb-4 text-soil-700">Each step is saved as you go; a draft can be left and picked up again from the trial list.</p>
      <WizardNav trialId={null} current="basics" />
      <BasicsStep
        trialId={null}
        initial={{ title: "", crop: "", season: String(new Date().getFullYear()), siteId: "", objective: "", plantingDate: "" }}
        sites={sites}
        readOnlyReason={null}
        canAddSite={can(user.role, "site:manage")}
      />
    </section>
  );
}
