import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PlotValueTable } from "@/components/uploads/PlotValueTable";
import { UploadPanel } from "@/components/uploads/UploadPanel";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { can } from "@/lib/auth/permissions";
import { plotValuesOf } from "@/lib/data/assessment-data";
import { findAssessment } from "@/lib/data/assessments";
import { versionsOf } from "@/lib/data/observations";
import { defaultIngestLimits } from "@/lib/ingest/types";
import { trialForPage } from "@/lib/trials/page-access";
import { uuidSchema } from "@/lib/validations/common";

export const metadata: Metadata = { title: "Assessment data" };
export const dynamic = "force-dynamic";

export default async function AssessmentDataPage({ params }: { params: Promise<{ trialId: string; assessmentId: string }> }) {
  const { trialId, assessmentId } = await params;
  const { user, trial } = await trialForPage(trialId);
  if (!uuidSchema.safeParse(assessmentId).success) notFound();
  const assessment = await findAssessment(trial.id, assessmentId);
  if (!assessment) notFound();
  const [values, versions] = await Promise.all([plotValuesOf(trial, assessment), versionsOf(assessment.id)]);
  const mayUpload = can(user.role, "upload:create") && (trial.status === "active" || trial.status === "locked");
  const exportBase = `/api/exports?trialId=${trial.id}&assessmentId=${assessment.id}`;

  return (
    <section className="space-y-6">
      <TrialHeading
        title={assessment.name}
        status={trial.status}
        back={{ href: `/trials/${trial.id}/data`, label: `${trial.title}: field data` }}
        lines={[`${assessment.quadratsPerPlot} quadrat${assessment.quadratsPerPlot === 1 ? "" : "s"} per plot · values in ${assessment.unit}${assessment.plannedDate ? ` · planned ${assessment.plannedDate}` : ""}`]}
      />
      <p className="text-sm">
        <Link href={`/trials/${trial.id}/sheets/${assessment.id}`} className="text-leaf-700 underline">
          Data sheet and CSV template
        </Link>
        {" · "}
        <a href={`${exportBase}&kind=raw`} className="text-leaf-700 underline">
          Download raw values (CSV)
        </a>
        {" · "}
        <a href={`${exportBase}&kind=plot`} className="text-leaf-700 underline">
          Download plot values (CSV)
        </a>
      </p>
      {mayUpload ? (
        <UploadPanel trialId={trial.id} assessmentId={assessment.id} unit={assessment.unit} needsReason={trial.status === "locked"} maxMegabytes={defaultIngestLimits.maxBytes / 1024 / 1024} />
      ) : (
        <p className="rounded border border-soil-200 bg-white p-4 text-sm text-soil-700">
          {trial.status === "draft"
            ? "Data can be recorded once the trial is active."
            : trial.status === "published"
              ? "This trial is published; its data can no longer change."
              : "Your role reads these data; technicians and the trial's researcher record them."}
        </p>
      )}
      <div>
        <h2 className="mb-2 text-lg font-semibold">Plot values now</h2>
        <PlotValueTable rows={values} />
      </div>
      <div>
        <h2 className="mb-2 text-lg font-semibold">Versions</h2>
        {versions.length === 0 ? (
          <p className="text-sm text-soil-700">No data recorded yet.</p>
        ) : (
          <ol className="divide-y divide-soil-100 rounded border border-soil-200 bg-white text-sm" data-testid="versions">
            {versions.map((version) => (
              <li key={version.id} className="flex flex-col gap-1 p-3 sm:flex-row sm:items-center sm:gap-4">
                <span className="font-semibold">Version {version.number}</span>
                <span className="flex-1 text-soil-700">
                  {version.source === "upload" ? `Upload of ${version.fileName}` : "Per-plot entry"} by {version.createdBy},{" "}
                  {version.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC · {version.rowsAdded} values, {version.rowsReplaced} replaced
                  {version.sha256 && <span className="block font-mono text-xs">SHA-256 {version.sha256}</span>}
                  {version.reason && <span className="block">Reason: {version.reason}</span>}
                </span>
                <Link href={`/trials/${trial.id}/data/${assessment.id}/versions/${version.number}`} className="text-leaf-700 underline">
                  What changed
                </Link>
              </li>
            ))}
          </ol>
        )}
      </div>
    </section>
  );
}
