import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { approveTrial } from "@/lib/reviews/service";
import { approveResponse, approveSchema, reviewTrialParams } from "@/lib/validations/reviews";

export const dynamic = "force-dynamic";

/** The reviewer's sign-off; it locks the trial. */
export const POST = route(
  { permission: "review:approve", params: reviewTrialParams, body: approveSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, user, body }) => {
    const request = await approveTrial(trial!, user.id, body.note);
    return jsonResponse(approveResponse, { id: request.id, status: "approved", trialStatus: "locked" });
  },
);
