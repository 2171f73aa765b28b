import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { plotMapPdf } from "@/lib/layout/map-pdf";
import { fieldPlan, fileSlug } from "@/lib/trials/field-sheets";
import { trialIdParams } from "@/lib/validations/common";

export const dynamic = "force-dynamic";

/** The plot map as a PDF to print or take to the field. */
export const GET = route({ permission: "trial:read", params: trialIdParams, trialId: ({ params }) => params.trialId }, async ({ trial }) => {
  const plan = await fieldPlan(trial!);
  if (plan.plots.length === 0) throw new AppError("CONFLICT", "This trial has no plot layout yet; randomize it first.");
  const pdf = await plotMapPdf({
    title: plan.title,
    subtitle: `Seed ${trial!.randomSeed} · ${trial!.blocks} ${trial!.design === "crd" ? "replicates" : "blocks"} · plots ${plan.plotLengthM} × ${plan.plotWidthM} m`,
    plots: plan.plots,
    treatments: plan.treatments,
    plotLengthM: plan.plotLengthM,
    plotWidthM: plan.plotWidthM,
    design: plan.design,
    serpentine: plan.serpentine,
    cautions: plan.cautions,
  });
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${fileSlug(plan.title)}-plot-map.pdf"`,
      "cache-control": "no-store",
    },
  });
});
