import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Cautions } from "@/components/safety/Cautions";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { findTreatment } from "@/lib/data/treatments";
import { cautionsFor } from "@/lib/safety/cautions";
import { categoryNames } from "@/lib/trials/labels";
import { trialForPage } from "@/lib/trials/page-access";
import { uuidSchema } from "@/lib/validations/common";

export const metadata: Metadata = { title: "Treatment" };
export const dynamic = "force-dynamic";

function perHa(value: number | null, unit: string): string {
  return value === null ? "not given" : `${value.toLocaleString("en", { maximumFractionDigits: 1 })} ${unit}`;
}

export default async function TreatmentPage({ params }: { params: Promise<{ trialId: string; treatmentId: string }> }) {
  const { trialId, treatmentId } = await params;
  const { trial } = await trialForPage(trialId);
  if (!uuidSchema.safeParse(treatmentId).success) notFound();
  const treatment = await findTreatment(trial.id, treatmentId);
  if (!treatment) notFound();
  const cautions = cautionsFor(treatment.category);
  const rows: [string, string][] = [
    ["Method", `${categoryNames[treatment.category]}${treatment.checkType ? ` (${treatment.checkType === "weedy" ? "weedy check" : "weed-free check"})` : ""}`],
    ["Timing", treatment.timing || "—"],
    ["Rate or settings", treatment.rateOrSettings || "—"],
    ["Labour", perHa(treatment.labourHoursPerHa, "hours per ha")],
    ["Material cost", perHa(treatment.materialCostPerHa, "per ha")],
  ];
  return (
    <section className="max-w-2xl">
      <TrialHeading title={`${treatment.code} · ${treatment.name}`} status={trial.status} back={{ href: `/trials/${trial.id}`, label: trial.title }} lines={[]} />
      {cautions.length > 0 && (
        <div className="mb-4">
          <Cautions cautions={cautions} />
        </div>
      )}
      {treatment.description && <p className="mb-4">{treatment.description}</p>}
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 rounded border border-soil-200 bg-white p-4">
        {rows.map(([term, value]) => (
          <div key={term} className="contents">
            <dt className="text-soil-700">{term}</dt>
            <dd>{value}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}
