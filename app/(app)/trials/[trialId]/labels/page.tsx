import type { Metadata } from "next";
import { StakeLabels } from "@/components/field/StakeLabels";
import { Cautions } from "@/components/safety/Cautions";
import { PrintButton } from "@/components/trials/PrintButton";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { TrialTabs } from "@/components/trials/TrialTabs";
import { can } from "@/lib/auth/permissions";
import { fieldPlan, plotUrl } from "@/lib/trials/field-sheets";
import { trialForPage } from "@/lib/trials/page-access";

export const metadata: Metadata = { title: "Stake labels" };
export const dynamic = "force-dynamic";

export default async function StakeLabelsPage({ params }: { params: Promise<{ trialId: string }> }) {
  const { trialId } = await params;
  const { user, trial } = await trialForPage(trialId);
  const plan = await fieldPlan(trial);
  return (
    <section>
      <div className="no-print">
        <TrialHeading title={trial.title} status={trial.status} back={{ href: `/trials/${trial.id}`, label: "Trial overview" }} lines={["One label per plot stake; the code opens the plot's page on a phone."]} />
        <TrialTabs trialId={trial.id} current="labels" canPlan={can(user.role, "trial:edit")} />
      </div>
      {plan.plots.length === 0 ? (
        <p className="rounded border border-dashed border-soil-200 bg-white p-4 text-soil-700">No plots are laid out yet, so there are no labels to print.</p>
      ) : (
        <>
          <div className="no-print mb-4">
            <PrintButton label="Print the labels" />
            <Cautions cautions={plan.cautions} />
          </div>
          <div data-testid="stake-labels">
            <StakeLabels
              trialTitle={trial.title}
              plots={plan.plots.map((plot) => ({ number: plot.number, block: plot.block, treatmentCode: plot.treatmentCode, category: plot.category, url: plotUrl(trial.id, plot.number) }))}
            />
          </div>
        </>
      )}
    </section>
  );
}
