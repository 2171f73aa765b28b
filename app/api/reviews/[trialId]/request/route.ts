import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { requestReview, withdrawReview } from "@/lib/reviews/service";
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

/** The owner withdraws an open request (409 when none is open). */
export const DELETE = route({ permission: "review:request", params: reviewTrialParams, trialId: ({ params }) => params.trialId }, async ({ trial, user }) => {
  const request = await withdrawReview(trial!, user.id);
  return jsonResponse(reviewRequestResponse, request.get({ plain: true }));
});
