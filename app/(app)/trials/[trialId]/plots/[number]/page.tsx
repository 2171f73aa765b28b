import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Cautions } from "@/components/safety/Cautions";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { findPlotByNumber } from "@/lib/data/plots";
import { findTreatment } from "@/lib/data/treatments";
import { cautionsFor } from "@/lib/safety/cautions";
import { PhotoPanel } from "@/components/uploads/PhotoPanel";
import { PlotEntry, type EntryAssessment } from "@/components/uploads/PlotEntry";
import { can } from "@/lib/auth/permissions";
import { assessmentsOf } from "@/lib/data/assessments";
import { currentValuesOfPlot } from "@/lib/data/observations";
import { photosOfPlot } from "@/lib/photos/service";
import { blockWord, categoryNames } from "@/lib/trials/labels";
import { trialForPage } from "@/lib/trials/page-access";

export const metadata: Metadata = { title: "Plot" };
export const dynamic = "force-dynamic";

/** The current assessment: the one planned nearest to today. */
function nearestToToday(assessments: EntryAssessment[]): string {
  const today = Date.now();
  const distance = (entry: EntryAssessment) => (entry.plannedDate ? Math.abs(Date.parse(entry.plannedDate) - today) : Number.POSITIVE_INFINITY);
  return [...assessments].sort((a, b) => distance(a) - distance(b))[0]?.id ?? "";
}

/** Where a stake's code leads: the plot, its treatment, and (for those who collect) data entry and photos. */
export default async function PlotPage({ params }: { params: Promise<{ trialId: string; number: string }> }) {
  const { trialId, number } = await params;
  const { user, trial } = await trialForPage(trialId);
  if (!/^\d{1,6}$/.test(number)) notFound();
  const plot = await findPlotByNumber(trial.id, Number(number));
  if (!plot) notFound();
  const treatment = (await findTreatment(trial.id, plot.treatmentId))!;
  const cautions = cautionsFor(treatment.category);
  const mayRecord = can(user.role, "observation:write") && (trial.status === "active" || trial.status === "locked");
  const [assessments, current, photos] = await Promise.all([assessmentsOf(trial.id), currentValuesOfPlot(trial.id, plot.number), photosOfPlot(trial.id, plot.id)]);
  const entryAssessments: EntryAssessment[] = assessments.map((assessment) => ({
    id: assessment.id,
    name: assessment.name,
    unit: assessment.unit,
    quadratsPerPlot: assessment.quadratsPerPlot,
    plannedDate: assessment.plannedDate,
    current: Object.fromEntries(
      (current.find((entry) => entry.assessmentId === assessment.id)?.values ?? []).filter((entry) => entry.species === "").map((entry) => [entry.quadrat, entry.value]),
    ),
  }));
  const word = blockWord(trial.design, 1);
  return (
    <section className="max-w-xl">
      <TrialHeading title={`Plot ${plot.number}`} status={trial.status} back={{ href: `/trials/${trial.id}`, label: trial.title }} lines={[trial.title]} />
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 rounded border border-soil-200 bg-white p-4 text-base">
        <dt className="text-soil-700">{word[0].toUpperCase() + word.slice(1)}</dt>
        <dd data-testid="plot-block">{plot.block}</dd>
        <dt className="text-soil-700">Treatment</dt>
        <dd data-testid="plot-treatment">
          <span className="font-mono font-semibold">{treatment.code}</span> {treatment.name}
          <span className="block text-sm text-soil-700">{categoryNames[treatment.category]}</span>
        </dd>
        <dt className="text-soil-700">Field position</dt>
        <dd>
          row {plot.row}, column {plot.column} (walk order {plot.walkOrder})
        </dd>
        {treatment.timing && (
          <>
            <dt className="text-soil-700">Timing</dt>
            <dd>{treatment.timing}</dd>
          </>
        )}
      </dl>
      {cautions.length > 0 && (
        <div className="mt-4">
          <Cautions cautions={cautions} />
        </div>
      )}
      {mayRecord && entryAssessments.length > 0 && (
        <div className="mt-4 space-y-4">
          <PlotEntry trialId={trial.id} plotNumber={plot.number} assessments={entryAssessments} initialAssessmentId={nearestToToday(entryAssessments)} needsReason={trial.status === "locked"} />
          <PhotoPanel trialId={trial.id} plotNumber={plot.number} assessmentId={nearestToToday(entryAssessments) || null} />
        </div>
      )}
      {photos.length > 0 && (
        <section className="mt-4" aria-labelledby="photos-heading">
          <h2 id="photos-heading" className="mb-2 text-lg font-semibold">
            Photos
          </h2>
          <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3" data-testid="plot-photos">
            {photos.map((photo) => (
              <li key={photo.id}>
                <a href={`/api/photos/${photo.id}/original`} target="_blank" rel="noopener">
                  {/* eslint-disable-next-line @next/next/no-img-element -- served through our own access check */}
                  <img src={`/api/photos/${photo.id}/thumbnail`} alt={photo.caption || `Plot ${plot.number} photo`} className="aspect-square w-full rounded border border-soil-200 object-cover" />
                </a>
                <p className="mt-1 text-xs text-soil-700">
                  {photo.caption ? `${photo.caption} · ` : ""}
                  {photo.createdAt.toISOString().slice(0, 10)}
                </p>
              </li>
            ))}
          </ul>
        </section>
      )}
      <p className="mt-4 text-sm">
        <Link href={`/trials/${trial.id}/map`} className="text-leaf-700 underline">
          See the plot map
        </Link>
      </p>
    </section>
  );
}
