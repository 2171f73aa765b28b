import type { Metadata } from "next";
import Link from "next/link";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { TrialTabs } from "@/components/trials/TrialTabs";
import { can } from "@/lib/auth/permissions";
import { assessmentsOf } from "@/lib/data/assessments";
import { plotCount } from "@/lib/data/plots";
import { variableNames } from "@/lib/trials/labels";
import { trialForPage } from "@/lib/trials/page-access";
import { dueDate } from "@/lib/trials/schedule";

export const metadata: Metadata = { title: "Data sheets" };
export const dynamic = "force-dynamic";

export default async function DataSheetsPage({ params }: { params: Promise<{ trialId: string }> }) {
  const { trialId } = await params;
  const { user, trial } = await trialForPage(trialId);
  const [assessments, plots] = await Promise.all([assessmentsOf(trial.id), plotCount(trial.id)]);
  return (
    <section>
      <TrialHeading title={trial.title} status={trial.status} back={{ href: `/trials/${trial.id}`, label: "Trial overview" }} lines={["A printable sheet and a CSV template for every assessment, plots in walking order."]} />
      <TrialTabs trialId={trial.id} current="sheets" canPlan={can(user.role, "trial:edit")} />
      {plots === 0 && <p className="mb-4 rounded border border-dashed border-soil-200 bg-white p-4 text-soil-700">No plots are laid out yet; the sheets fill in once they are.</p>}
      {assessments.length === 0 ? (
        <p className="text-soil-700">No assessments planned yet.</p>
      ) : (
        <ul className="divide-y divide-soil-100 rounded border border-soil-200 bg-white">
          {assessments.map((assessment) => {
            const due = dueDate(assessment, trial.plantingDate);
            return (
              <li key={assessment.id} className="flex flex-col gap-2 p-3 sm:flex-row sm:items-center" data-testid="sheet-row">
                <div className="flex-1">
                  <Link href={`/trials/${trial.id}/sheets/${assessment.id}`} className="font-medium text-leaf-700 underline">
                    {assessment.name}
                  </Link>
                  <p className="text-sm text-soil-700">
                    {variableNames[assessment.variable]} · {assessment.unit} · {assessment.quadratsPerPlot} per plot{due ? ` · due ${due}` : ""}
                  </p>
                </div>
                {plots > 0 && (
                  <div className="flex gap-3 text-sm">
                    <a className="text-leaf-700 underline" href={`/api/trials/${trial.id}/assessments/${assessment.id}/sheet?format=long`}>
                      CSV (long)
                    </a>
                    <a className="text-leaf-700 underline" href={`/api/trials/${trial.id}/assessments/${assessment.id}/sheet?format=wide`}>
                      CSV (wide)
                    </a>
                  </div>
                )}
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
