import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { requestReview } from "@/lib/reviews/service";
import { reviewRequestResponse, reviewRequestSchema, reviewTrialParams } from "@/lib/validations/reviews";

export const dynamic = "force-dynamic";

/** The researcher asks the trial's reviewers to read the analyses and sign off. */
export const POST = route(
  { permission: "review:request", params: reviewTrialParams, body: reviewRequestSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, user, body }) => {
    const request = await requestReview(trial!, user.id, body.message);
    return jsonResponse(reviewRequestResponse, request.get({ plain: true }), 201);
  },
);
