import { invitationsOf } from "@/lib/invitations/service";
import { InviteForm } from "./InviteForm";

/** Server part of the team page's "Invite by e-mail" section. */
export async function TeamInvitations({ trialId, readOnlyReason }: { trialId: string; readOnlyReason: string | null }) {
  const invitations = await invitationsOf(trialId);
  return (
    <InviteForm
      trialId={trialId}
      readOnlyReason={readOnlyReason}
      initial={invitations.map((invitation) => ({ ...invitation, expiresAt: invitation.expiresAt.toISOString(), createdAt: invitation.createdAt.toISOString() }))}
    />
  );
}
