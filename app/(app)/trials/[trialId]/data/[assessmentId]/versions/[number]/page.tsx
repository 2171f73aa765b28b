import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { findAssessment } from "@/lib/data/assessments";
import { versionAuditOf } from "@/lib/data/audit";
import { changesIn, versionsOf, type VersionRow } from "@/lib/data/observations";
import { trialForPage } from "@/lib/trials/page-access";
import { uuidSchema } from "@/lib/validations/common";

export const metadata: Metadata = { title: "What changed" };
export const dynamic = "force-dynamic";

const show = (value: number | null) => (value === null ? "—" : String(value));

/** A version row says upload or manual; the audit event also knows versions no person keyed, such as the demo's. */
function sourceText(version: VersionRow, auditSource: string | undefined): string {
  if (version.source === "upload") return `Upload of ${version.fileName ?? "a file"}`;
  if (auditSource === "demo seed") return "Demo seed";
  return "Per-plot entry";
}

export default async function VersionChangesPage({ params }: { params: Promise<{ trialId: string; assessmentId: string; number: string }> }) {
  const { trialId, assessmentId, number } = await params;
  const { trial } = await trialForPage(trialId);
  if (!uuidSchema.safeParse(assessmentId).success || !/^\d{1,6}$/.test(number)) notFound();
  const assessment = await findAssessment(trial.id, assessmentId);
  if (!assessment) notFound();
  const version = (await versionsOf(assessment.id)).find((entry) => entry.number === Number(number));
  if (!version) notFound();
  const [changes, audit] = await Promise.all([changesIn(version.id), versionAuditOf(trial.id, assessment.id, version.number)]);
  return (
    <section>
      <TrialHeading
        title={`Version ${version.number}: what changed`}
        status={trial.status}
        back={{ href: `/trials/${trial.id}/data/${assessment.id}`, label: assessment.name }}
        lines={[
          `${sourceText(version, audit?.source)} by ${version.createdBy}, ${version.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC`,
          ...(audit?.afterLock ? ["Made after the trial was locked"] : []),
          ...(version.reason ? [`Reason given: ${version.reason}`] : []),
        ]}
      />
      <p className="mb-3 text-sm text-soil-700">
        {changes.length === 0
          ? "This version changed no values against the one before it."
          : `${changes.length} value${changes.length === 1 ? "" : "s"} differ from the version before; unchanged values are not listed.`}
      </p>
      {changes.length > 0 && (
        <div className="overflow-x-auto rounded border border-soil-200 bg-white">
          <table className="w-full text-sm" data-testid="changes">
            <thead className="bg-soil-100 text-left text-soil-700">
              <tr>
                <th className="px-3 py-2">Plot</th>
                <th className="px-3 py-2">Quadrat</th>
                <th className="px-3 py-2">Species</th>
                <th className="px-3 py-2 text-right">Before</th>
                <th className="px-3 py-2 text-right">After</th>
              </tr>
            </thead>
            <tbody>
              {changes.map((change) => (
                <tr key={`${change.plotNumber}-${change.quadrat}-${change.species}`} className="border-t border-soil-100">
                  <td className="px-3 py-1.5">{change.plotNumber}</td>
                  <td className="px-3 py-1.5">{change.quadrat}</td>
                  <td className="px-3 py-1.5">{change.species || "–"}</td>
                  <td className="px-3 py-1.5 text-right tabular-nums">{show(change.before)}</td>
                  <td className="px-3 py-1.5 text-right tabular-nums">{show(change.after)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
