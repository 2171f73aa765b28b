import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { invitationOfTrial, trialOfInvitation } from "@/lib/invitations/access";
import { invitationSummarySchema } from "@/lib/invitations/schemas";
import { invitationState, resendInvitation } from "@/lib/invitations/service";
import { invitationIdParams } from "@/lib/validations/invitations";

export const dynamic = "force-dynamic";

/** Sends a fresh link; the previous link stops working. */
export const POST = route(
  { permission: "trial:manage-team", params: invitationIdParams, trialId: ({ params }) => trialOfInvitation(params.invitationId) },
  async ({ params, user, trial }) => {
    const invitation = await resendInvitation(user, trial!, await invitationOfTrial(params.invitationId, trial!.id));
    return jsonResponse(invitationSummarySchema, { ...invitation.get({ plain: true }), state: invitationState(invitation) });
  },
);
