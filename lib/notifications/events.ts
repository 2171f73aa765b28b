/**
 * What happened, as the rest of the app reports it. The notifications module decides who
 * hears about it, by e-mail or digest, under each person's settings.
 */
export type NotificationEvent =
  | { type: "upload-committed"; trialId: string; assessmentId: string; versionNumber: number; actorId: string }
  | { type: "data-changed-after-lock"; trialId: string; assessmentId: string; versionNumber: number; reason: string; actorId: string }
  | { type: "review-requested"; trialId: string; actorId: string }
  | { type: "comment-added"; trialId: string; assessmentId: string | null; commentId: string; actorId: string }
  | { type: "trial-approved"; trialId: string; actorId: string }
  | { type: "trial-published"; trialId: string; actorId: string };

export type NotificationType = NotificationEvent["type"] | "assessment-due";
