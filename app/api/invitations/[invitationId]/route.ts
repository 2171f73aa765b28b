import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { invitationOfTrial, trialOfInvitation } from "@/lib/invitations/access";
import { invitationSummarySchema } from "@/lib/invitations/schemas";
import { invitationState, revokeInvitation } from "@/lib/invitations/service";
import { invitationIdParams } from "@/lib/validations/invitations";

export const dynamic = "force-dynamic";

/** Withdraws a pending invitation: its link stops working at once. */
export const DELETE = route(
  { permission: "trial:manage-team", params: invitationIdParams, trialId: ({ params }) => trialOfInvitation(params.invitationId) },
  async ({ params, trial }) => {
    const invitation = await revokeInvitation(await invitationOfTrial(params.invitationId, trial!.id));
    return jsonResponse(invitationSummarySchema, { ...invitation.get({ plain: true }), state: invitationState(invitation) });
  },
);
