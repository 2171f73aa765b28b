import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { notify } from "@/lib/notifications/notify";
import type { CommittedVersion } from "./commit-version";

/**
 * Tells the trial's reviewers about a version that changed data after their sign-off.
 *
 * Whether it came after the lock is read from the audit event commitVersion wrote: that was
 * decided under the assessment's lock, so a trial locked between the page load and the
 * commit is not missed. commitVersion owns its transaction, so this runs after it commits; a
 * crash in between loses the mail only, as the review page lists the change from the audit.
 */
export async function noticeIfAfterLock(version: CommittedVersion, change: { trialId: string; assessmentId: string; actorId: string }): Promise<void> {
  try {
    const [event] = await db().query<{ reason: string | null }>(
      `SELECT reason FROM audit_events
        WHERE trial_id = :trialId AND entity_type = 'assessment-data' AND entity_id = :assessmentId
          AND after_lock AND (new_value->>'version')::int = :number
        LIMIT 1`,
      { replacements: { trialId: change.trialId, assessmentId: change.assessmentId, number: version.number }, type: QueryTypes.SELECT },
    );
    if (!event) return;
    await notify({ type: "data-changed-after-lock", trialId: change.trialId, assessmentId: change.assessmentId, versionNumber: version.number, reason: event.reason ?? "", actorId: change.actorId });
  } catch (error) {
    // The data are committed; a lost notice must not turn the save into an error.
    console.error("after-lock notice could not be queued", error);
  }
}
