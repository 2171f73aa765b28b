import { assessmentResults } from "@/lib/analysis/assessment-results";
import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { analysisOptionsSchema, assessmentAnalysisParams, assessmentResultsSchema } from "@/lib/validations/analysis";

export const dynamic = "force-dynamic";

/** An assessment's results under the options in the query string; cached by data version. */
export const GET = route(
  { permission: "analysis:read", params: assessmentAnalysisParams, query: analysisOptionsSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, params, query }) => {
    const { results, cache } = await assessmentResults(trial!, params.assessmentId, query);
    const response = jsonResponse(assessmentResultsSchema, results);
    response.headers.set("x-analysis-cache", cache);
    response.headers.set("cache-control", "private, no-store");
    return response;
  },
);
