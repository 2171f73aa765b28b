import "server-only";
import { absoluteUrl } from "@/lib/mail/urls";
import type { NoticeContent } from "./deliver";

/** What each notice says. Names and titles are plain strings; templates.ts escapes them. */
export const notices = {
  uploadCommitted(input: { trialId: string; trialTitle: string; assessmentId: string; assessmentName: string; versionNumber: number; actorName: string }): NoticeContent {
    return {
      subject: `New data for ${input.trialTitle}`,
      summary: `${input.actorName} uploaded version ${input.versionNumber} of “${input.assessmentName}” in ${input.trialTitle}.`,
      paragraphs: [`${input.actorName} uploaded version ${input.versionNumber} of the data for “${input.assessmentName}” in the trial “${input.trialTitle}”.`],
      link: { label: "See the data", url: absoluteUrl(`/trials/${input.trialId}/data/${input.assessmentId}`) },
    };
  },
  dataChangedAfterLock(input: { trialId: string; trialTitle: string; assessmentId: string; assessmentName: string; versionNumber: number; reason: string; actorName: string }): NoticeContent {
    return {
      subject: `Data changed after lock: ${input.trialTitle}`,
      summary: `${input.actorName} changed “${input.assessmentName}” in the locked trial ${input.trialTitle} (version ${input.versionNumber}): ${input.reason}`,
      paragraphs: [
        `${input.actorName} changed the data for “${input.assessmentName}” in the trial “${input.trialTitle}” after it was approved and locked; the change is version ${input.versionNumber}.`,
        `Reason given: ${input.reason}`,
      ],
      link: { label: "See what changed", url: absoluteUrl(`/trials/${input.trialId}/data/${input.assessmentId}/versions/${input.versionNumber}`) },
    };
  },
  reviewRequested(input: { trialId: string; trialTitle: string; actorName: string }): NoticeContent {
    return {
      subject: `Review requested: ${input.trialTitle}`,
      summary: `${input.actorName} asks you to review ${input.trialTitle}.`,
      paragraphs: [`${input.actorName} asks you to review the analysis of the trial “${input.trialTitle}”.`],
      link: { label: "Open the trial", url: absoluteUrl(`/trials/${input.trialId}`) },
    };
  },
  commentAdded(input: { trialId: string; trialTitle: string; assessmentId: string | null; actorName: string }): NoticeContent {
    return {
      subject: `New comment on ${input.trialTitle}`,
      summary: `${input.actorName} commented on ${input.trialTitle}.`,
      paragraphs: [`${input.actorName} added a comment to the trial “${input.trialTitle}”.`],
      link: { label: "Read the comment", url: absoluteUrl(input.assessmentId ? `/trials/${input.trialId}/data/${input.assessmentId}` : `/trials/${input.trialId}`) },
    };
  },
  trialApproved(input: { trialId: string; trialTitle: string; actorName: string }): NoticeContent {
    return {
      subject: `Approved: ${input.trialTitle}`,
      summary: `${input.actorName} approved ${input.trialTitle}.`,
      paragraphs: [`${input.actorName} reviewed and approved the trial “${input.trialTitle}”.`],
      link: { label: "Open the trial", url: absoluteUrl(`/trials/${input.trialId}`) },
    };
  },
  trialPublished(input: { trialId: string; trialTitle: string; crop: string }): NoticeContent {
    return {
      subject: `New ${input.crop.toLowerCase()} results: ${input.trialTitle}`,
      summary: `New published results for ${input.crop}: ${input.trialTitle}.`,
      paragraphs: [`Results of the trial “${input.trialTitle}” on ${input.crop} are now published, with costs and what they mean in the field.`],
      link: { label: "Read the results", url: absoluteUrl(`/library/${input.trialId}`) },
    };
  },
  assessmentDue(input: { trialId: string; trialTitle: string; assessmentId: string; assessmentName: string; plannedDate: string }): NoticeContent {
    return {
      subject: `Due tomorrow: ${input.assessmentName} (${input.trialTitle})`,
      summary: `“${input.assessmentName}” in ${input.trialTitle} is due on ${input.plannedDate}.`,
      paragraphs: [`The assessment “${input.assessmentName}” in the trial “${input.trialTitle}” is planned for tomorrow, ${input.plannedDate}.`, "Data sheets and plot entry are ready in Hoebench."],
      link: { label: "Open the assessment", url: absoluteUrl(`/trials/${input.trialId}/data/${input.assessmentId}`) },
    };
  },
};
