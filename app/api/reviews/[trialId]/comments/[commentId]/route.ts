import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { setResolved } from "@/lib/reviews/service";
import { commentResponse, resolveSchema, reviewCommentParams } from "@/lib/validations/reviews";

export const dynamic = "force-dynamic";

/** Marks a thread resolved (or opens it again). */
export const PATCH = route(
  { permission: "review:comment", params: reviewCommentParams, body: resolveSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, user, params, body }) => {
    const comment = await setResolved(trial!, user.id, params.commentId, body.resolved);
    return jsonResponse(commentResponse, comment.get({ plain: true }));
  },
);
