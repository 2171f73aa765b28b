import Link from "next/link";
import type { TrialSummary } from "@/lib/data/trials";
import { StatusBadge } from "./StatusBadge";

const designNames = { rcbd: "Randomized complete block", crd: "Completely randomized", latin: "Latin square" } as const;

/** Each title opens the trial's page, or for growers (who see published trials only) its library entry. */
export function TrialList({ trials, empty, linkTo = "trial" }: { trials: TrialSummary[]; empty: string; linkTo?: "trial" | "library" }) {
  if (trials.length === 0) return <p className="rounded border border-dashed border-soil-200 bg-white p-6 text-soil-700">{empty}</p>;
  return (
    <ul className="divide-y divide-soil-100 rounded border border-soil-200 bg-white">
      {trials.map((trial) => (
        <li key={trial.id} className="flex flex-col gap-1 p-4 sm:flex-row sm:items-center sm:gap-4" data-testid="trial-row">
          <div className="flex-1">
            <p className="font-medium">
              <Link href={linkTo === "library" ? `/library/${trial.id}` : `/trials/${trial.id}`} className="text-leaf-700 underline-offset-2 hover:underline">
                {trial.title}
              </Link>
            </p>
            <p className="text-sm text-soil-700">
              {trial.crop} · {trial.season} · {trial.siteName}, {trial.region}
            </p>
            <p className="text-xs text-soil-500">
              {designNames[trial.design]}, {trial.blocks} {trial.design === "crd" ? "replicates" : "blocks"}
            </p>
          </div>
          <div className="self-start sm:self-center"><StatusBadge status={trial.status} /></div>
        </li>
      ))}
    </ul>
  );
}
