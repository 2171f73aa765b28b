import type { Metadata } from "next";
import Link from "next/link";
import { CourseChart } from "@/components/charts/ResultCharts";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { TrialTabs } from "@/components/trials/TrialTabs";
import { weedDensityCourse } from "@/lib/analysis/course";
import { can } from "@/lib/auth/permissions";
import { dataStatusOf } from "@/lib/data/assessment-data";
import { trialForPage } from "@/lib/trials/page-access";

export const metadata: Metadata = { title: "Results" };
export const dynamic = "force-dynamic";

export default async function TrialResultsPage({ params }: { params: Promise<{ trialId: string }> }) {
  const { trialId } = await params;
  const { user, trial } = await trialForPage(trialId, "analysis:read");
  const [assessments, course] = await Promise.all([dataStatusOf(trial.id), weedDensityCourse(trial)]);
  return (
    <section className="space-y-6">
      <TrialHeading title={trial.title} status={trial.status} lines={[`${trial.crop} · ${trial.season}`]} />
      <TrialTabs trialId={trial.id} current="results" canPlan={can(user.role, "trial:edit")} />
      <div>
        <h2 className="mb-3 text-lg font-semibold">Results by assessment</h2>
        <ul className="divide-y divide-soil-100 rounded border border-soil-200 bg-white" data-testid="results-list">
          {assessments.map((assessment) => (
            <li key={assessment.id} className="flex flex-col gap-1 p-4 sm:flex-row sm:items-center">
              <Link href={`/trials/${trial.id}/results/${assessment.id}`} className="flex-1 font-medium text-leaf-700 underline">
                {assessment.name}
              </Link>
              <span className="text-sm text-soil-700">{assessment.latestVersion ? `${assessment.plotsWithValues} plots · data version ${assessment.latestVersion}` : "No data yet"}</span>
            </li>
          ))}
        </ul>
      </div>
      {course.series.length > 0 && <CourseChart series={course.series} unit={course.unit} />}
      <p className="text-sm">
        <Link href="/combined" className="text-leaf-700 underline">Combined analysis over sites and years</Link>
      </p>
    </section>
  );
}
