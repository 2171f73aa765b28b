import type { Metadata } from "next";
import { LinkProblem } from "@/components/invitations/LinkProblem";
import { ResetPasswordForm } from "@/components/invitations/ResetPasswordForm";
import { resetLinkState, resetRefusals } from "@/lib/password-reset/service";
import { linkTokenSchema } from "@/lib/validations/invitations";

export const metadata: Metadata = { title: "Choose a new password", referrer: "no-referrer" };
export const dynamic = "force-dynamic";

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const link = linkTokenSchema.safeParse(token).success ? await resetLinkState(token) : { state: "unknown" as const };
  if (link.state !== "valid" || !("email" in link) || !link.email) {
    const state = link.state === "valid" ? "unknown" : link.state;
    return <LinkProblem title="This link cannot be used" message={resetRefusals[state]} next={{ href: "/forgot-password", label: "Ask for a new link" }} />;
  }
  return <ResetPasswordForm token={token} email={link.email} />;
}
