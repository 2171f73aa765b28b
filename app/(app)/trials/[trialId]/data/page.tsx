import type { Metadata } from "next";
import Link from "next/link";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { TrialTabs } from "@/components/trials/TrialTabs";
import { can } from "@/lib/auth/permissions";
import { dataStatusOf } from "@/lib/data/assessment-data";
import { trialForPage } from "@/lib/trials/page-access";

export const metadata: Metadata = { title: "Field data" };
export const dynamic = "force-dynamic";

export default async function TrialDataPage({ params }: { params: Promise<{ trialId: string }> }) {
  const { trialId } = await params;
  const { user, trial } = await trialForPage(trialId);
  const assessments = await dataStatusOf(trial.id);
  return (
    <section>
      <TrialHeading title={trial.title} status={trial.status} lines={[`${trial.crop} · ${trial.season}`]} />
      <TrialTabs trialId={trial.id} current="data" canPlan={can(user.role, "trial:edit")} />
      <h2 className="mb-3 text-lg font-semibold">Field data by assessment</h2>
      {assessments.length === 0 && <p className="rounded border border-dashed border-soil-200 bg-white p-6">This trial has no assessments yet.</p>}
      <ul className="divide-y divide-soil-100 rounded border border-soil-200 bg-white">
        {assessments.map((assessment) => (
          <li key={assessment.id} className="flex flex-col gap-1 p-4 sm:flex-row sm:items-center">
            <div className="flex-1">
              <Link href={`/trials/${trial.id}/data/${assessment.id}`} className="font-medium text-leaf-700 underline">
                {assessment.name}
              </Link>
              <p className="text-sm text-soil-700">
                {assessment.plannedDate ? `Planned ${assessment.plannedDate} · ` : ""}
                {assessment.quadratsPerPlot} quadrat{assessment.quadratsPerPlot === 1 ? "" : "s"} per plot · {assessment.unit}
              </p>
            </div>
            <p className="text-sm" data-testid={`data-status-${assessment.id}`}>
              {assessment.latestVersion
                ? `${assessment.plotsWithValues} plots · version ${assessment.latestVersion}`
                : "No data yet"}
            </p>
          </li>
        ))}
      </ul>
    </section>
  );
}
