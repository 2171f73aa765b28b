import Link from "next/link";
import { Cautions } from "@/components/safety/Cautions";
import type { TreatmentRecord } from "@/lib/data/treatments";
import { cautionsFor } from "@/lib/safety/cautions";
import { categoryNames } from "@/lib/trials/labels";

// toLocaleString with options builds a new formatter per call; these are built once.
const formatters = new Map<number, Intl.NumberFormat>();

function amount(value: number | null, unit: string, digits = 1): string {
  if (value === null) return "not given";
  let formatter = formatters.get(digits);
  if (!formatter) formatters.set(digits, (formatter = new Intl.NumberFormat("en", { maximumFractionDigits: digits })));
  return `${formatter.format(value)} ${unit}`;
}

/** The treatment list as cards that read on a phone, each chemical, thermal or machine treatment with its cautions. */
export function TreatmentTable({ trialId, treatments }: { trialId: string; treatments: TreatmentRecord[] }) {
  if (treatments.length === 0) return <p className="text-soil-700">No treatments yet.</p>;
  return (
    <ol className="space-y-3">
      {treatments.map((treatment) => {
        const cautions = cautionsFor(treatment.category);
        return (
          <li key={treatment.id} className="rounded border border-soil-200 bg-white p-3" data-testid="treatment-item">
            <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
              <span className="rounded bg-soil-100 px-2 py-0.5 font-mono text-sm font-semibold">{treatment.code}</span>
              <Link href={`/trials/${trialId}/treatments/${treatment.id}`} className="font-medium text-leaf-700 underline-offset-2 hover:underline">
                {treatment.name}
              </Link>
              <span className="text-sm text-soil-700">
                {categoryNames[treatment.category]}
                {treatment.checkType ? ` · ${treatment.checkType === "weedy" ? "weedy check" : "weed-free check"}` : ""}
              </span>
            </div>
            <dl className="mt-2 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-2 lg:grid-cols-4">
              <div>
                <dt className="inline text-soil-700">Timing: </dt>
                <dd className="inline">{treatment.timing || "—"}</dd>
              </div>
              <div>
                <dt className="inline text-soil-700">Rate or settings: </dt>
                <dd className="inline">{treatment.rateOrSettings || "—"}</dd>
              </div>
              <div>
                <dt className="inline text-soil-700">Labour: </dt>
                <dd className="inline">{amount(treatment.labourHoursPerHa, "h/ha")}</dd>
              </div>
              <div>
                <dt className="inline text-soil-700">Material: </dt>
                <dd className="inline">{amount(treatment.materialCostPerHa, "per ha", 0)}</dd>
              </div>
            </dl>
            {cautions.length > 0 && (
              <div className="mt-2">
                <Cautions cautions={cautions} />
              </div>
            )}
          </li>
        );
      })}
    </ol>
  );
}
