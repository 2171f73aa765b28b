import type { Metadata } from "next";
import { AcceptInvitation, type AcceptMode } from "@/components/invitations/AcceptInvitation";
import { LinkProblem } from "@/components/invitations/LinkProblem";
import { currentUser } from "@/lib/auth/session";
import { invitationByToken, refusalFor, roleRefusalForInvitee, unknownLink } from "@/lib/invitations/service";
import { linkTokenSchema } from "@/lib/validations/invitations";

export const metadata: Metadata = { title: "Trial invitation", referrer: "no-referrer" };
export const dynamic = "force-dynamic";

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const view = linkTokenSchema.safeParse(token).success ? await invitationByToken(token) : null;
  if (!view) return <LinkProblem title="Invitation not found" message={unknownLink().message} next={{ href: "/signin", label: "Go to sign-in" }} />;
  if (view.state !== "pending") {
    return <LinkProblem title="This invitation cannot be used" message={refusalFor(view.state, view.inviterName).message} next={{ href: "/signin", label: "Go to sign-in" }} />;
  }
  // Said before any sign-in form: signing in with an account of another role cannot help.
  const roleRefusal = roleRefusalForInvitee(view);
  if (roleRefusal) return <LinkProblem title="This invitation cannot be used with your account" message={roleRefusal.message} next={{ href: "/signin", label: "Go to sign-in" }} />;
  const user = await currentUser();
  const mode: AcceptMode = user
    ? user.email === view.invitation.email
      ? { kind: "join" }
      : { kind: "other-account", signedInAs: user.email }
    : view.accountExists
      ? { kind: "sign-in" }
      : { kind: "create" };
  return (
    <AcceptInvitation
      token={token}
      email={view.invitation.email}
      trialTitle={view.trial.title}
      role={view.invitation.role}
      inviterName={view.inviterName}
      mode={mode}
    />
  );
}
