import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DataSheet } from "@/components/field/DataSheet";
import { PrintButton } from "@/components/trials/PrintButton";
import { findAssessment } from "@/lib/data/assessments";
import { fieldPlan } from "@/lib/trials/field-sheets";
import { trialForPage } from "@/lib/trials/page-access";
import { dueDate } from "@/lib/trials/schedule";
import { uuidSchema } from "@/lib/validations/common";

export const metadata: Metadata = { title: "Data sheet" };
export const dynamic = "force-dynamic";

export default async function DataSheetPage({
  params,
  searchParams,
}: {
  params: Promise<{ trialId: string; assessmentId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { trialId, assessmentId } = await params;
  // Blind by default: a scorer who does not know the treatment scores more fairly.
  const showTreatments = (await searchParams).treatments === "show";
  const { trial } = await trialForPage(trialId);
  if (!uuidSchema.safeParse(assessmentId).success) notFound();
  const assessment = await findAssessment(trial.id, assessmentId);
  if (!assessment) notFound();
  const plan = await fieldPlan(trial);
  const csv = `/api/trials/${trial.id}/assessments/${assessment.id}/sheet`;
  const treatmentsParam = showTreatments ? "&treatments=show" : "";
  return (
    <section>
      <div className="no-print mb-4 flex flex-wrap items-center gap-3">
        <Link href={`/trials/${trial.id}/sheets`} className="mr-auto text-sm text-leaf-700 underline">
          ← All data sheets
        </Link>
        <Link href={showTreatments ? "?" : "?treatments=show"} className="text-sm text-leaf-700 underline">
          {showTreatments ? "Hide treatment codes (blind scoring)" : "Show treatment codes"}
        </Link>
        <PrintButton label="Print the sheet" />
        <a href={`${csv}?format=long${treatmentsParam}`} className="rounded border border-soil-200 bg-white px-4 py-2 text-sm font-medium hover:bg-soil-100">
          CSV template (long)
        </a>
        <a href={`${csv}?format=wide${treatmentsParam}`} className="rounded border border-soil-200 bg-white px-4 py-2 text-sm font-medium hover:bg-soil-100">
          CSV template (wide)
        </a>
      </div>
      {plan.plots.length === 0 ? (
        <p className="rounded border border-dashed border-soil-200 bg-white p-4 text-soil-700">No plots are laid out yet.</p>
      ) : (
        <div data-testid="data-sheet">
          <DataSheet
            trialTitle={trial.title}
            assessmentName={assessment.name}
            unit={assessment.unit}
            plannedDate={dueDate(assessment, trial.plantingDate)}
            quadratsPerPlot={assessment.quadratsPerPlot}
            plots={plan.plots.map(({ number, block, walkOrder, treatmentCode }) => ({ number, block, walkOrder, ...(showTreatments ? { treatmentCode } : {}) }))}
            cautions={plan.cautions}
          />
        </div>
      )}
    </section>
  );
}
