import { renderMail, type RenderedMail } from "@/lib/mail/templates";
import { absoluteUrl } from "@/lib/mail/urls";

const longDate = (date: Date) => date.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

export function invitationMail(input: { token: string; trialTitle: string; crop: string; role: string; inviterName: string; expiresAt: Date }): RenderedMail {
  return renderMail({
    subject: `${input.inviterName} invites you to the trial ${input.trialTitle}`,
    greeting: "Hello,",
    paragraphs: [
      `${input.inviterName} invites you to join the ${input.crop.toLowerCase()} trial “${input.trialTitle}” in Hoebench as a ${input.role}.`,
      `The link below works once and until ${longDate(input.expiresAt)}. With it you can create your account, or join with the account you already have for this address.`,
    ],
    action: { label: "Accept the invitation", url: absoluteUrl(`/invite/${input.token}`) },
    footer: "If you did not expect this invitation, ignore this mail; nothing happens unless you open the link.",
  });
}
