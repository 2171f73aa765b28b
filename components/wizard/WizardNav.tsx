import Link from "next/link";
import { wizardSteps, type WizardStep } from "@/lib/trials/labels";

/** The wizard's steps; every step is saved, so any of them can be opened at any time. */
export function WizardNav({ trialId, current }: { trialId: string | null; current: WizardStep }) {
  return (
    <nav aria-label="Trial plan steps" className="no-print mb-6">
      <ol className="flex flex-wrap gap-2 text-sm">
        {wizardSteps.map((step, index) => {
          const active = step.key === current;
          const label = `${index + 1}. ${step.label}`;
          const style = `block rounded border px-3 py-1.5 ${active ? "border-leaf-600 bg-leaf-600 text-white" : "border-soil-200 bg-white text-soil-700 hover:bg-soil-100"}`;
          return (
            <li key={step.key}>
              {trialId ? (
                <Link href={`/trials/${trialId}/plan/${step.key}`} aria-current={active ? "step" : undefined} className={style}>
                  {label}
                </Link>
              ) : (
                <span aria-current={active ? "step" : undefined} className={`${style} ${active ? "" : "opacity-60"}`}>
                  {label}
                </span>
              )}
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
