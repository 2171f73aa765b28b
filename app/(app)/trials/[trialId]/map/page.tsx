import type { Metadata } from "next";
import { PlotMapFrame, plotMapCacheKey } from "@/components/field/PlotMapFrame";
import { Cautions } from "@/components/safety/Cautions";
import { PrintButton } from "@/components/trials/PrintButton";
import { RandomizeButton } from "@/components/trials/RandomizeButton";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { TrialTabs } from "@/components/trials/TrialTabs";
import { can } from "@/lib/auth/permissions";
import { randomizeRefusal } from "@/lib/trials/edit-rules";
import { fieldPlan } from "@/lib/trials/field-sheets";
import { blockWord, designNames } from "@/lib/trials/labels";
import { hasObservations } from "@/lib/trials/observations";
import { trialForPage } from "@/lib/trials/page-access";

export const metadata: Metadata = { title: "Plot map" };
export const dynamic = "force-dynamic";

export default async function PlotMapPage({ params }: { params: Promise<{ trialId: string }> }) {
  const { trialId } = await params;
  const { user, trial } = await trialForPage(trialId);
  const plan = await fieldPlan(trial);
  const canRandomize = can(user.role, "trial:randomize") && !randomizeRefusal(trial.status) && plan.treatments.length >= 2 && !(await hasObservations(trial.id));
  return (
    <section className="print-page">
      <TrialHeading
        title={trial.title}
        status={trial.status}
        back={{ href: `/trials/${trial.id}`, label: "Trial overview" }}
        lines={[
          `${designNames[trial.design]} · ${trial.blocks} ${blockWord(trial.design, trial.blocks)} · ${plan.plots.length} plots of ${trial.plotLengthM} × ${trial.plotWidthM} m`,
          `Random seed ${trial.randomSeed}${trial.serpentine ? " · serpentine numbering" : ""}`,
        ]}
      />
      <TrialTabs trialId={trial.id} current="map" canPlan={can(user.role, "trial:edit")} />
      {plan.plots.length === 0 ? (
        <div className="space-y-3">
          <p className="rounded border border-dashed border-soil-200 bg-white p-4 text-soil-700">No plots are laid out yet. Save the design step of the plan to lay them out.</p>
          {canRandomize && <RandomizeButton trialId={trial.id} hasLayout={false} />}
        </div>
      ) : (
        <>
          <div className="no-print mb-4 flex flex-wrap items-center gap-3">
            <PrintButton label="Print the map" />
            <a href={`/api/trials/${trial.id}/map`} className="rounded bg-leaf-600 px-4 py-2 text-sm font-medium text-white hover:bg-leaf-700" download>
              Download PDF
            </a>
            {canRandomize && <RandomizeButton trialId={trial.id} hasLayout />}
          </div>
          <PlotMapFrame
            cacheKey={plotMapCacheKey(trial, "printable")}
            className="overflow-x-auto rounded border border-soil-200 bg-white p-2 print:border-0 print:p-0"
            testId="plot-map"
            plan={plan}
            showWalkingOrder={plan.serpentine}
          />
          {plan.cautions.length > 0 && (
            <div className="mt-4 break-inside-avoid">
              <Cautions cautions={plan.cautions} />
            </div>
          )}
        </>
      )}
    </section>
  );
}
