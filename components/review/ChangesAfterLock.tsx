import Link from "next/link";
import type { ChangeAfterLock } from "@/lib/data/reviews";

const when = (date: Date) => `${new Date(date).toISOString().slice(0, 16).replace("T", " ")} UTC`;

function sourceOf(change: ChangeAfterLock): string {
  if (change.source === "upload") return change.fileName ? `upload of ${change.fileName}` : "upload";
  return "per-plot entry";
}

/**
 * The reviewer approved the data as they were; every version written after that lock is
 * listed here with its reason, so a sign-off never silently covers data it did not see.
 */
export function ChangesAfterLock({ trialId, changes, locked }: { trialId: string; changes: ChangeAfterLock[]; locked: boolean }) {
  if (!locked && changes.length === 0) return null;
  return (
    <section aria-labelledby="after-lock-heading" className="rounded border border-soil-200 bg-white p-4" data-testid="changes-after-lock">
      <h2 id="after-lock-heading" className="mb-1 text-lg font-semibold">Data changed after the lock</h2>
      {changes.length === 0 ? (
        <p className="text-sm text-soil-700">No data have changed since the trial was locked.</p>
      ) : (
        <>
          <p className="mb-2 text-sm font-semibold text-red-800">
            {changes.length} data change{changes.length === 1 ? " was" : "s were"} made after the trial was locked. Check each one against its reason.
          </p>
          <ol className="divide-y divide-soil-100 text-sm">
            {changes.map((change) => (
              <li key={change.id} className="border-l-4 border-red-700 py-2 pl-3" data-testid="change-after-lock">
                <p>
                  <span className="font-medium">{change.assessmentName}</span>, version {change.versionNumber} · {change.changedBy} · {when(change.createdAt)} · {sourceOf(change)}
                </p>
                <p>Reason: {change.reason ?? "none given"}</p>
                <Link href={`/trials/${trialId}/data/${change.assessmentId}/versions/${change.versionNumber}`} className="text-leaf-700 underline">
                  Values changed in version {change.versionNumber}
                </Link>
              </li>
            ))}
          </ol>
        </>
      )}
    </section>
  );
}
