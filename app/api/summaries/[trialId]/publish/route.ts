import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { publishTrial } from "@/lib/summaries/publish";
import { trialIdParams } from "@/lib/validations/common";

export const dynamic = "force-dynamic";

/** Locked → published, storing the summary text and the numbers behind it (409 unless locked). */
// The body carries nothing, and anything else in it is refused before the trial is touched.
const publishBody = z.object({}).strict();

export const POST = route({ permission: "trial:publish", params: trialIdParams, body: publishBody, trialId: ({ params }) => params.trialId }, async ({ user, params }) => {
  const { publishedAt } = await publishTrial(user, params.trialId);
  return jsonResponse(z.object({ trialId: z.string(), status: z.literal("published"), publishedAt: z.date(), libraryUrl: z.string() }), {
    trialId: params.trialId,
    status: "published",
    publishedAt,
    libraryUrl: `/library/${params.trialId}`,
  });
});
