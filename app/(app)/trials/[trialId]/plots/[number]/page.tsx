import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Cautions } from "@/components/safety/Cautions";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { findPlotByNumber } from "@/lib/data/plots";
import { findTreatment } from "@/lib/data/treatments";
import { cautionsFor } from "@/lib/safety/cautions";
import { blockWord, categoryNames } from "@/lib/trials/labels";
import { trialForPage } from "@/lib/trials/page-access";

export const metadata: Metadata = { title: "Plot" };
export const dynamic = "force-dynamic";

/** Where a stake's code leads. Read-only for now; data entry per plot comes with field collection. */
export default async function PlotPage({ params }: { params: Promise<{ trialId: string; number: string }> }) {
  const { trialId, number } = await params;
  const { trial } = await trialForPage(trialId);
  if (!/^\d{1,6}$/.test(number)) notFound();
  const plot = await findPlotByNumber(trial.id, Number(number));
  if (!plot) notFound();
  const treatment = (await findTreatment(trial.id, plot.treatmentId))!;
  const cautions = cautionsFor(treatment.category);
  const word = blockWord(trial.design, 1);
  return (
    <section className="max-w-xl">
      <TrialHeading title={`Plot ${plot.number}`} status={trial.status} back={{ href: `/trials/${trial.id}`, label: trial.title }} lines={[trial.title]} />
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 rounded border border-soil-200 bg-white p-4 text-base">
        <dt className="text-soil-700">{word[0].toUpperCase() + word.slice(1)}</dt>
        <dd data-testid="plot-block">{plot.block}</dd>
        <dt className="text-soil-700">Treatment</dt>
        <dd data-testid="plot-treatment">
          <span className="font-mono font-semibold">{treatment.code}</span> {treatment.name}
          <span className="block text-sm text-soil-700">{categoryNames[treatment.category]}</span>
        </dd>
        <dt className="text-soil-700">Field position</dt>
        <dd>
          row {plot.row}, column {plot.column} (walk order {plot.walkOrder})
        </dd>
        {treatment.timing && (
          <>
            <dt className="text-soil-700">Timing</dt>
            <dd>{treatment.timing}</dd>
          </>
        )}
      </dl>
      {cautions.length > 0 && (
        <div className="mt-4">
          <Cautions cautions={cautions} />
        </div>
      )}
      <p className="mt-4 text-sm">
        <Link href={`/trials/${trial.id}/map`} className="text-leaf-700 underline">
          See the plot map
        </Link>
      </p>
    </section>
  );
}
