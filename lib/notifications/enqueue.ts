import "server-only";
import type { Transaction } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { Assessment, Trial, User } from "@/models";
import { deliverNotice, type DeliveryOutcome, type NoticeContent, type Recipient } from "./deliver";
import type { NotificationEvent } from "./events";
import { notices } from "./messages";
import { activeUsers, followersOf, teamIds } from "./recipients";

type Reading = { transaction?: Transaction };

async function actorName(actorId: string, reading: Reading): Promise<string> {
  const actor = await User.findByPk(actorId, { attributes: ["name"], ...reading });
  return actor?.name ?? "Someone";
}

/** Who hears about an event, and what they are told. */
async function plan(event: NotificationEvent, trial: Trial, reading: Reading): Promise<{ recipients: Recipient[]; notice: NoticeContent } | null> {
  const base = { trialId: trial.id, trialTitle: trial.title };
  switch (event.type) {
    case "upload-committed": {
      // Owners uploading to their own trial are not told of it: nothing more to read.
      const recipients = await activeUsers([trial.ownerId], event.actorId, reading);
      if (recipients.length === 0) return null;
      const assessment = await Assessment.findByPk(event.assessmentId, { attributes: ["name"], ...reading });
      return {
        recipients,
        notice: notices.uploadCommitted({ ...base, assessmentId: event.assessmentId, assessmentName: assessment?.name ?? "an assessment", versionNumber: event.versionNumber, actorName: await actorName(event.actorId, reading) }),
      };
    }
    case "data-changed-after-lock": {
      // The sign-off was given on the data as they were: whoever reviews the trial has to see
      // what changed since, and why.
      const assessment = await Assessment.findByPk(event.assessmentId, { attributes: ["name"], ...reading });
      return {
        recipients: await activeUsers(await teamIds(trial.id, ["reviewer"], reading), event.actorId, reading),
        notice: notices.dataChangedAfterLock({
          ...base,
          assessmentId: event.assessmentId,
          assessmentName: assessment?.name ?? "an assessment",
          versionNumber: event.versionNumber,
          reason: event.reason,
          actorName: await actorName(event.actorId, reading),
        }),
      };
    }
    case "review-requested":
      return {
        recipients: await activeUsers(await teamIds(trial.id, ["reviewer"], reading), event.actorId, reading),
        notice: notices.reviewRequested({ ...base, actorName: await actorName(event.actorId, reading) }),
      };
    case "comment-added":
      return {
        recipients: await activeUsers([trial.ownerId, ...(await teamIds(trial.id, ["reviewer"], reading))], event.actorId, reading),
        notice: notices.commentAdded({ ...base, assessmentId: event.assessmentId, actorName: await actorName(event.actorId, reading) }),
      };
    case "trial-approved":
      return {
        recipients: await activeUsers([trial.ownerId, ...(await teamIds(trial.id, ["technician"], reading))], event.actorId, reading),
        notice: notices.trialApproved({ ...base, actorName: await actorName(event.actorId, reading) }),
      };
    case "trial-published":
      return {
        recipients: await activeUsers(await followersOf(trial, reading), event.actorId, reading),
        notice: notices.trialPublished({ ...base, crop: trial.crop }),
      };
  }
}

/**
 * Turns an event into queued mail (or digest entries) for the right people under their
 * settings. Given the action's transaction, everything is read and written through it, so
 * the notices commit or roll back with the action.
 */
export async function enqueueNotifications(event: NotificationEvent, reading: Reading = {}): Promise<Map<string, DeliveryOutcome>> {
  db();
  const outcomes = new Map<string, DeliveryOutcome>();
  const trial = await Trial.findByPk(event.trialId, reading);
  if (!trial) return outcomes;
  const planned = await plan(event, trial, reading);
  if (!planned) return outcomes;
  for (const recipient of planned.recipients) {
    outcomes.set(recipient.email, await deliverNotice(recipient, event.type, planned.notice, reading));
  }
  return outcomes;
}
