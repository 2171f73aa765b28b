import type { Metadata } from "next";
import Link from "next/link";
import { PlotMapFrame, plotMapCacheKey } from "@/components/field/PlotMapFrame";
import { AssessmentSchedule } from "@/components/trials/AssessmentSchedule";
import { RandomizeButton } from "@/components/trials/RandomizeButton";
import { StatusPanel } from "@/components/trials/StatusPanel";
import { TreatmentTable } from "@/components/trials/TreatmentTable";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { TrialTabs } from "@/components/trials/TrialTabs";
import { can } from "@/lib/auth/permissions";
import { assessmentsOf } from "@/lib/data/assessments";
import { treatmentsOf } from "@/lib/data/treatments";
import { teamOf, trialOverview } from "@/lib/data/trials";
import { randomizeRefusal } from "@/lib/trials/edit-rules";
import { fieldPlan } from "@/lib/trials/field-sheets";
import { blockWord, designNames } from "@/lib/trials/labels";
import { hasObservations } from "@/lib/trials/observations";
import { trialForPage } from "@/lib/trials/page-access";
import { readinessOf } from "@/lib/trials/readiness";
import { assessmentSchedule, todayIso } from "@/lib/trials/schedule";

export const metadata: Metadata = { title: "Trial" };
export const dynamic = "force-dynamic";

const statusText = {
  draft: "Draft: the plan can still change.",
  active: "Active: the layout is in the field and data are being collected.",
  locked: "Locked after the reviewer's sign-off; read-only.",
  published: "Published; read-only.",
} as const;

export default async function TrialPage({ params }: { params: Promise<{ trialId: string }> }) {
  const { trialId } = await params;
  const { user, trial } = await trialForPage(trialId);
  const loadingTreatments = treatmentsOf(trial.id);
  const [overview, treatments, assessments, team, plan, readiness, observed] = await Promise.all([
    trialOverview(trial),
    loadingTreatments,
    assessmentsOf(trial.id),
    teamOf(trial.id),
    fieldPlan(trial, loadingTreatments),
    readinessOf(trial.id),
    hasObservations(trial.id),
  ]);
  const canEdit = can(user.role, "trial:edit");
  const canRandomize = can(user.role, "trial:randomize") && !randomizeRefusal(trial.status) && !observed && treatments.length >= 2;
  const schedule = assessmentSchedule(assessments, trial.plantingDate, todayIso());
  const showStates = trial.status === "active" || trial.status === "draft";
  const facts: [string, string][] = [
    ["Design", designNames[trial.design]],
    [`${blockWord(trial.design)[0].toUpperCase()}${blockWord(trial.design).slice(1)}`, String(trial.blocks)],
    ["Plot size", `${trial.plotLengthM} × ${trial.plotWidthM} m`],
    ["Harvest area", `${trial.harvestAreaM2} m²`],
    ["Quadrat", `${trial.quadratAreaM2} m²`],
    ["Planting date", trial.plantingDate ?? "not set"],
    ["Random seed", String(trial.randomSeed)],
    ["Plot numbering", trial.serpentine ? "serpentine" : "every row west to east"],
  ];

  return (
    <section>
      <TrialHeading
        title={trial.title}
        status={trial.status}
        lines={[`${trial.crop} · ${trial.season} · ${overview.site.name}, ${overview.site.region} (${overview.site.location})`, `Owner: ${overview.ownerName}`]}
      />
      <TrialTabs trialId={trial.id} current="overview" canPlan={canEdit} />
      <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
        <div className="space-y-6">
          {trial.objective && (
            <section aria-labelledby="objective-heading">
              <h2 id="objective-heading" className="mb-1 text-lg font-semibold">Objective</h2>
              <p className="text-soil-900">{trial.objective}</p>
            </section>
          )}
          <section aria-labelledby="map-heading">
            <div className="mb-2 flex flex-wrap items-center gap-3">
              <h2 id="map-heading" className="mr-auto text-lg font-semibold">Plot map</h2>
              {plan.plots.length > 0 && (
                <Link href={`/trials/${trial.id}/map`} className="text-sm text-leaf-700 underline">
                  Open the printable map
                </Link>
              )}
            </div>
            {plan.plots.length > 0 ? (
              <PlotMapFrame
                cacheKey={plotMapCacheKey(trial, "overview")}
                className="overflow-x-auto rounded border border-soil-200 bg-white p-2"
                plan={plan}
              />
            ) : (
              <p className="rounded border border-dashed border-soil-200 bg-white p-4 text-soil-700">No plots laid out yet.</p>
            )}
            {canRandomize && <div className="mt-2"><RandomizeButton trialId={trial.id} hasLayout={plan.plots.length > 0} /></div>}
          </section>
          <section aria-labelledby="treatments-heading">
            <h2 id="treatments-heading" className="mb-2 text-lg font-semibold">Treatments ({treatments.length})</h2>
            <TreatmentTable trialId={trial.id} treatments={treatments} />
          </section>
          <section aria-labelledby="schedule-heading">
            <h2 id="schedule-heading" className="mb-2 text-lg font-semibold">Assessment schedule</h2>
            <AssessmentSchedule trialId={trial.id} rows={schedule} showStates={showStates} />
          </section>
        </div>
        <aside className="space-y-6">
          <section aria-labelledby="status-heading" className="rounded border border-soil-200 bg-white p-4">
            <h2 id="status-heading" className="mb-1 font-semibold">Status</h2>
            <p className="mb-3 text-sm text-soil-700">{statusText[trial.status as keyof typeof statusText]}</p>
            {trial.status === "draft" && can(user.role, "trial:change-status") && <StatusPanel trialId={trial.id} missing={readiness.missing} warnings={readiness.warnings} />}
            {trial.status === "draft" && canEdit && (
              <Link href={`/trials/${trial.id}/plan/basics`} className="mt-3 inline-block text-sm text-leaf-700 underline">
                Continue planning
              </Link>
            )}
          </section>
          <section aria-labelledby="layout-heading" className="rounded border border-soil-200 bg-white p-4">
            <h2 id="layout-heading" className="mb-2 font-semibold">Design and plots</h2>
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
              {facts.map(([term, value]) => (
                <div key={term} className="contents">
                  <dt className="text-soil-700">{term}</dt>
                  <dd data-testid={term === "Random seed" ? "random-seed" : undefined}>{value}</dd>
                </div>
              ))}
            </dl>
          </section>
          <section aria-labelledby="team-heading" className="rounded border border-soil-200 bg-white p-4">
            <h2 id="team-heading" className="mb-2 font-semibold">Team</h2>
            <ul className="space-y-1 text-sm">
              <li>
                {overview.ownerName} <span className="text-soil-700">· owner</span>
              </li>
              {team.map((member) => (
                <li key={member.userId} data-testid="team-member">
                  {member.name} <span className="text-soil-700">· {member.role}</span>
                </li>
              ))}
            </ul>
            {can(user.role, "trial:manage-team") && trial.status !== "locked" && trial.status !== "published" && (
              <Link href={`/trials/${trial.id}/plan/team`} className="mt-2 inline-block text-sm text-leaf-700 underline">
                Change the team
              </Link>
            )}
          </section>
          <section aria-labelledby="print-heading" className="rounded border border-soil-200 bg-white p-4">
            <h2 id="print-heading" className="mb-2 font-semibold">Take it to the field</h2>
            <ul className="space-y-1 text-sm">
              <li><Link className="text-leaf-700 underline" href={`/trials/${trial.id}/map`}>Plot map (print or PDF)</Link></li>
              <li><Link className="text-leaf-700 underline" href={`/trials/${trial.id}/labels`}>Stake labels</Link></li>
              <li><Link className="text-leaf-700 underline" href={`/trials/${trial.id}/sheets`}>Data sheets</Link></li>
            </ul>
          </section>
        </aside>
      </div>
    </section>
  );
}
