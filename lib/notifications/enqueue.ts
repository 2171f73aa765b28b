import "server-only";
import { db } from "@/lib/db/sequelize";
import { Assessment, Trial, User } from "@/models";
import { deliverNotice, type DeliveryOutcome, type NoticeContent, type Recipient } from "./deliver";
import type { NotificationEvent } from "./events";
import { notices } from "./messages";
import { activeUsers, followersOf, teamIds } from "./recipients";

async function actorName(actorId: string): Promise<string> {
  const actor = await User.findByPk(actorId, { attributes: ["name"] });
  return actor?.name ?? "Someone";
}

/** Who hears about an event, and what they are told. */
async function plan(event: NotificationEvent, trial: Trial): Promise<{ recipients: Recipient[]; notice: NoticeContent } | null> {
  const base = { trialId: trial.id, trialTitle: trial.title };
  switch (event.type) {
    case "upload-committed": {
      const assessment = await Assessment.findByPk(event.assessmentId, { attributes: ["name"] });
      return {
        recipients: await activeUsers([trial.ownerId], event.actorId),
        notice: notices.uploadCommitted({ ...base, assessmentId: event.assessmentId, assessmentName: assessment?.name ?? "an assessment", versionNumber: event.versionNumber, actorName: await actorName(event.actorId) }),
      };
    }
    case "review-requested":
      return {
        recipients: await activeUsers(await teamIds(trial.id, ["reviewer"]), event.actorId),
        notice: notices.reviewRequested({ ...base, actorName: await actorName(event.actorId) }),
      };
    case "comment-added":
      return {
        recipients: await activeUsers([trial.ownerId, ...(await teamIds(trial.id, ["reviewer"]))], event.actorId),
        notice: notices.commentAdded({ ...base, assessmentId: event.assessmentId, actorName: await actorName(event.actorId) }),
      };
    case "trial-approved":
      return {
        recipients: await activeUsers([trial.ownerId, ...(await teamIds(trial.id, ["technician"]))], event.actorId),
        notice: notices.trialApproved({ ...base, actorName: await actorName(event.actorId) }),
      };
    case "trial-published":
      return {
        recipients: await activeUsers(await followersOf(trial), event.actorId),
        notice: notices.trialPublished({ ...base, crop: trial.crop }),
      };
  }
}

/** Turns an event into queued mail (or digest entries) for the right people under their settings. */
export async function enqueueNotifications(event: NotificationEvent): Promise<Map<string, DeliveryOutcome>> {
  db();
  const outcomes = new Map<string, DeliveryOutcome>();
  const trial = await Trial.findByPk(event.trialId);
  if (!trial) return outcomes;
  const planned = await plan(event, trial);
  if (!planned) return outcomes;
  for (const recipient of planned.recipients) {
    outcomes.set(recipient.email, await deliverNotice(recipient, event.type, planned.notice));
  }
  return outcomes;
}
