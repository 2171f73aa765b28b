import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { reportCsv, reportJson } from "@/lib/reports/export";
import { trialReport } from "@/lib/reports/report-data";
import { fileSlug } from "@/lib/trials/field-sheets";
import { analysisOptionsSchema } from "@/lib/validations/analysis";
import { reviewTrialParams } from "@/lib/validations/reviews";

export const dynamic = "force-dynamic";

// The analysis options are checked by their own schema below (a bad one answers 422).
const exportQuery = z.object({ format: z.enum(["csv", "json"]).default("json") }).catchall(z.string());

/** All results of a trial as CSV or JSON. */
export const GET = route(
  { permission: "analysis:read", params: reviewTrialParams, query: exportQuery, trialId: ({ params }) => params.trialId },
  async ({ trial, query }) => {
    const { format, ...rest } = query;
    const report = await trialReport(trial!, analysisOptionsSchema.parse(rest));
    const name = `${fileSlug(trial!.title)}-results.${format}`;
    const body = format === "csv" ? reportCsv(report) : JSON.stringify(reportJson(report), null, 2);
    return new Response(body, {
      headers: { "content-type": format === "csv" ? "text/csv; charset=utf-8" : "application/json", "content-disposition": `attachment; filename="${name}"`, "cache-control": "no-store" },
    });
  },
);
