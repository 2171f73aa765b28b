import type { Metadata } from "next";
import Link from "next/link";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { TrialTabs } from "@/components/trials/TrialTabs";
import { can } from "@/lib/auth/permissions";
import { auditTrailOf } from "@/lib/data/audit";
import { trialForPage } from "@/lib/trials/page-access";

export const metadata: Metadata = { title: "Audit trail" };
export const dynamic = "force-dynamic";

export default async function AuditPage({ params }: { params: Promise<{ trialId: string }> }) {
  const { trialId } = await params;
  const { user, trial } = await trialForPage(trialId, "audit:read");
  const events = await auditTrailOf(trial.id);
  const afterLock = events.filter((event) => event.afterLock).length;
  return (
    <section>
      <TrialHeading title={trial.title} status={trial.status} lines={[`${trial.crop} · ${trial.season}`]} />
      <TrialTabs trialId={trial.id} current="audit" canPlan={can(user.role, "trial:edit")} />
      <h2 className="text-lg font-semibold">Audit trail</h2>
      <p className="mb-3 text-sm text-soil-700">
        Every change to this trial&apos;s data: who, when, what and why. Each data version lists the values it changed.
        {afterLock > 0 && <strong className="block text-red-800">{afterLock} change{afterLock === 1 ? " was" : "s were"} made after the trial was locked.</strong>}
      </p>
      {events.length === 0 ? (
        <p className="rounded border border-dashed border-soil-200 bg-white p-6">Nothing has changed yet.</p>
      ) : (
        <ol className="divide-y divide-soil-100 rounded border border-soil-200 bg-white text-sm" data-testid="audit-trail">
          {events.map((event) => (
            <li key={event.id} className={`p-3 ${event.afterLock ? "border-l-4 border-red-700 bg-red-50" : ""}`}>
              <p>
                <span className="font-medium">{event.userName}</span> · {event.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC
                {event.afterLock && <span className="ml-2 rounded bg-red-100 px-1.5 text-xs font-semibold text-red-900">after lock</span>}
              </p>
              <p>
                {event.assessmentName ? `${event.assessmentName}: ` : ""}
                {event.summary}
              </p>
              <p className="text-xs text-soil-700">Source: {event.source}</p>
              {event.reason && <p>Reason: {event.reason}</p>}
              {event.entityType === "assessment-data" && event.versionNumber && (
                <Link href={`/trials/${trial.id}/data/${event.entityId}/versions/${event.versionNumber}`} className="text-leaf-700 underline">
                  Values changed in version {event.versionNumber}
                </Link>
              )}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
