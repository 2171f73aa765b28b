import type { NotificationType } from "./events";

/** Every kind of notice, in the order the settings page lists them, with who usually gets it. */
export const notificationTypes = [
  { type: "upload-committed", label: "New data uploaded to a trial I own" },
  { type: "review-requested", label: "A review is requested from me" },
  { type: "comment-added", label: "A comment on a trial I own or review" },
  { type: "data-changed-after-lock", label: "Data changed in a locked trial I review" },
  { type: "trial-approved", label: "A trial I work on is approved" },
  { type: "assessment-due", label: "An assessment is due tomorrow" },
  { type: "trial-published", label: "A new published trial for a crop or method I follow" },
] as const satisfies readonly { type: NotificationType; label: string }[];

export const notificationTypeKeys = notificationTypes.map((entry) => entry.type) as [NotificationType, ...NotificationType[]];
