import { z } from "zod";
import { publicRoute } from "@/lib/auth/guard";
import { currentUser } from "@/lib/auth/session";
import { jsonResponse } from "@/lib/http";
import { acceptInvitation } from "@/lib/invitations/service";
import { acceptInvitationSchema } from "@/lib/validations/invitations";

export const dynamic = "force-dynamic";

const acceptedSchema = z.object({ trialId: z.string(), email: z.string(), createdAccount: z.boolean() });

/**
 * Public because the invited person may have no account yet; the link's token is the
 * credential. A signed-in caller must be the invited address.
 */
export const POST = publicRoute(
  { why: "invited people accept before they have an account; the single-use token authorizes", body: acceptInvitationSchema },
  async ({ body }) => {
    const outcome = await acceptInvitation(body.token, await currentUser(), { name: body.name, password: body.password });
    return jsonResponse(acceptedSchema, outcome, 201);
  },
);
