import { route } from "@/lib/auth/guard";
import { trialReport } from "@/lib/reports/report-data";
import { trialReportPdf } from "@/lib/reports/report-pdf";
import { fileSlug } from "@/lib/trials/field-sheets";
import { analysisOptionsSchema } from "@/lib/validations/analysis";
import { reviewTrialParams } from "@/lib/validations/reviews";

export const dynamic = "force-dynamic";

/** The technical report as a PDF, analysed with the options in the query string. */
export const GET = route(
  { permission: "analysis:read", params: reviewTrialParams, query: analysisOptionsSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, query }) => {
    const report = await trialReport(trial!, query);
    const pdf = await trialReportPdf(report);
    return new Response(new Uint8Array(pdf), {
      headers: { "content-type": "application/pdf", "content-disposition": `attachment; filename="${fileSlug(trial!.title)}-technical-report.pdf"`, "cache-control": "no-store" },
    });
  },
);
