import { route } from "@/lib/auth/guard";
import { findAssessment } from "@/lib/data/assessments";
import { AppError, notFound } from "@/lib/errors";
import { dataSheetCsv } from "@/lib/layout/data-sheet";
import { fieldPlan, fileSlug } from "@/lib/trials/field-sheets";
import { assessmentSheetParams, sheetQuerySchema } from "@/lib/validations/trial";

export const dynamic = "force-dynamic";

/** A CSV template for one assessment, one row per plot and quadrat (long) or per plot (wide). */
export const GET = route(
  { permission: "trial:read", params: assessmentSheetParams, query: sheetQuerySchema, trialId: ({ params }) => params.trialId },
  async ({ trial, params, query }) => {
    const assessment = await findAssessment(trial!.id, params.assessmentId);
    if (!assessment) throw notFound("assessment");
    const plan = await fieldPlan(trial!);
    if (plan.plots.length === 0) throw new AppError("CONFLICT", "This trial has no plot layout yet; randomize it first.");
    const csv = dataSheetCsv({
      plots: plan.plots.map(({ number, block, treatmentCode, walkOrder }) => ({ number, block, treatmentCode, walkOrder })),
      quadratsPerPlot: assessment.quadratsPerPlot,
      format: query.format,
      includeTreatment: query.treatments === "show",
    });
    return new Response(csv, {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="${fileSlug(plan.title)}-${fileSlug(assessment.name)}-${query.format}.csv"`,
        "cache-control": "no-store",
      },
    });
  },
);
