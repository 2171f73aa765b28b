import { publicRoute } from "@/lib/auth/guard";
import { publishedTrial } from "@/lib/data/library";
import { notFound } from "@/lib/errors";
import { trialReport } from "@/lib/reports/report-data";
import { trialReportPdf } from "@/lib/reports/report-pdf";
import { fileSlug } from "@/lib/trials/field-sheets";
import { trialIdParams } from "@/lib/validations/common";
import { analysisOptionsSchema } from "@/lib/validations/analysis";

export const dynamic = "force-dynamic";

/** A published trial's technical report as a PDF, with the default analysis options; any other trial is 404. */
export const GET = publicRoute(
  { why: "Published trials' technical reports are open to everyone who reads the library; unpublished trials answer 404.", params: trialIdParams },
  async ({ params }) => {
    const trial = await publishedTrial(params.trialId);
    if (!trial) throw notFound("trial");
    const pdf = await trialReportPdf(await trialReport(trial, analysisOptionsSchema.parse({})));
    return new Response(new Uint8Array(pdf), {
      headers: { "content-type": "application/pdf", "content-disposition": `attachment; filename="${fileSlug(trial.title)}-technical-report.pdf"` },
    });
  },
);
