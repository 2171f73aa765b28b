import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ResultsView } from "@/components/results/ResultsView";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { defaultControl, treatmentsOf } from "@/lib/analysis/assessment-results";
import { findAssessment } from "@/lib/data/assessments";
import { resultsOptionsFrom } from "@/lib/analysis/results-options";
import { trialForPage } from "@/lib/trials/page-access";
import { uuidSchema } from "@/lib/validations/common";

export const metadata: Metadata = { title: "Assessment results" };
export const dynamic = "force-dynamic";

export default async function AssessmentResultsPage({
  params,
  searchParams,
}: {
  params: Promise<{ trialId: string; assessmentId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { trialId, assessmentId } = await params;
  const { trial } = await trialForPage(trialId, "analysis:read");
  if (!uuidSchema.safeParse(assessmentId).success) notFound();
  const assessment = await findAssessment(trial.id, assessmentId);
  if (!assessment) notFound();
  const treatments = await treatmentsOf(trial.id);
  const isWeed = assessment.variable === "weed-density" || assessment.variable === "weed-biomass";
  return (
    <section className="space-y-4">
      <TrialHeading
        title={assessment.name}
        status={trial.status}
        back={{ href: `/trials/${trial.id}/results`, label: `${trial.title}: results` }}
        lines={[`${trial.design.toUpperCase()} · ${trial.blocks} blocks · ${treatments.length} treatments`]}
      />
      <p className="no-print text-sm">
        <Link href={`/trials/${trial.id}/data/${assessment.id}`} className="text-leaf-700 underline">Plot values and versions</Link>
        {" · "}
        <Link href={`/trials/${trial.id}/review#assessment-${assessment.id}`} className="text-leaf-700 underline">Review comments</Link>
      </p>
      <ResultsView
        trialId={trial.id}
        assessmentId={assessment.id}
        treatments={treatments.map(({ code, name }) => ({ code, name }))}
        initial={resultsOptionsFrom(
          await searchParams,
          { transform: "none", method: "lsd", alpha: "0.05", control: isWeed ? (defaultControl(treatments) ?? "") : "", reference: "", margin: "" },
          treatments.map((treatment) => treatment.code),
        )}
      />
    </section>
  );
}
