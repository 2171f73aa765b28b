import { renderMail, type RenderedMail } from "@/lib/mail/templates";
import { absoluteUrl } from "@/lib/mail/urls";

export function passwordResetMail(input: { token: string; name: string }): RenderedMail {
  return renderMail({
    subject: "Choose a new Hoebench password",
    greeting: `Hello ${input.name},`,
    paragraphs: [
      "Someone (we hope you) asked to reset the password of your Hoebench account.",
      "The link below works once, for one hour. Until you use it, your current password keeps working.",
    ],
    action: { label: "Choose a new password", url: absoluteUrl(`/reset-password/${input.token}`) },
    footer: "If you did not ask for this, ignore this mail; your password stays as it is.",
  });
}
