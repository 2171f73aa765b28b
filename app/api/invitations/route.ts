import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { invitationListSchema, invitationSummarySchema } from "@/lib/invitations/schemas";
import { createInvitation, invitationState, invitationsOf } from "@/lib/invitations/service";
import { createInvitationSchema, invitationListQuery } from "@/lib/validations/invitations";

export const dynamic = "force-dynamic";

export const GET = route(
  { permission: "trial:manage-team", query: invitationListQuery, trialId: ({ query }) => query.trialId },
  async ({ trial }) => jsonResponse(invitationListSchema, { invitations: await invitationsOf(trial!.id) }),
);

/** Invites a person by e-mail; the mail is queued, so a mail outage never fails this. */
export const POST = route(
  { permission: "trial:manage-team", body: createInvitationSchema, trialId: ({ body }) => body.trialId },
  async ({ user, trial, body }) => {
    const invitation = await createInvitation(user, trial!, { email: body.email, role: body.role });
    return jsonResponse(invitationSummarySchema, { ...invitation.get({ plain: true }), state: invitationState(invitation) }, 201);
  },
);
