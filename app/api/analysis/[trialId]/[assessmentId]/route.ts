import { assessmentResults } from "@/lib/analysis/assessment-results";
import { route } from "@/lib/auth/guard";
import { analysisOptionsSchema, assessmentAnalysisParams } from "@/lib/validations/analysis";

export const dynamic = "force-dynamic";

/** An assessment's results under the options in the query string; cached by data version. */
export const GET = route(
  { permission: "analysis:read", params: assessmentAnalysisParams, query: analysisOptionsSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, params, query }) => {
    // The body was shaped by assessmentResultsSchema when the results were computed (lib/analysis/assessment-results.ts).
    const { body, cache } = await assessmentResults(trial!, params.assessmentId, query);
    return new Response(body as BodyInit, { headers: { "content-type": "application/json", "x-analysis-cache": cache, "cache-control": "private, no-store" } });
  },
);
