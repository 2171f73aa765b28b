import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { addComment } from "@/lib/reviews/service";
import { commentResponse, commentSchema, reviewTrialParams } from "@/lib/validations/reviews";

export const dynamic = "force-dynamic";

/** A comment on the trial or one of its assessments, or a reply in a thread. */
export const POST = route(
  { permission: "review:comment", params: reviewTrialParams, body: commentSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, user, body }) => {
    const comment = await addComment(trial!, user.id, body);
    return jsonResponse(commentResponse, comment.get({ plain: true }), 201);
  },
);
