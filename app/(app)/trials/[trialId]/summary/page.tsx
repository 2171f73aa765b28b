import type { Metadata } from "next";
import Link from "next/link";
import { ResultsPanel } from "@/components/economics/ResultsPanel";
import { Cautions } from "@/components/safety/Cautions";
import { SummaryEditor } from "@/components/summary/SummaryEditor";
import { SummaryText } from "@/components/summary/SummaryText";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { TrialTabs } from "@/components/trials/TrialTabs";
import { can } from "@/lib/auth/permissions";
import { summaryOf } from "@/lib/data/summaries";
import { cautionsFor } from "@/lib/safety/cautions";
import { categoryNames } from "@/lib/trials/labels";
import { trialForPage } from "@/lib/trials/page-access";

export const metadata: Metadata = { title: "Summary for growers" };
export const dynamic = "force-dynamic";

export default async function TrialSummaryPage({ params }: { params: Promise<{ trialId: string }> }) {
  const { trialId } = await params;
  const { user, trial } = await trialForPage(trialId);
  const view = await summaryOf(trial);
  const canEdit = can(user.role, "summary:edit") && trial.status !== "published";
  const canPublish = can(user.role, "trial:publish") && trial.status === "locked";
  const hazardous = view.numbers.input.methods.filter((method) => method.checkType === null && cautionsFor(method.category).length > 0);

  return (
    <section>
      <TrialHeading title={trial.title} status={trial.status} lines={[`${trial.crop} · ${trial.season}`]} />
      <TrialTabs trialId={trial.id} current="summary" canPlan={can(user.role, "trial:edit")} />
      <p className="mb-4 max-w-prose text-sm text-soil-700">
        The plain-language summary growers read in the public library, generated from the reviewed results. You can edit the words before publishing; the numbers it came from are
        kept with it.
        {trial.status !== "published" && trial.status !== "locked" && " The trial can be published once the reviewer has signed it off (locked)."}
      </p>
      {trial.status === "published" && (
        // After publishing, the editor's refresh lands here, so this notice is what the researcher is left reading.
        <p role="status" className="mb-4 rounded bg-leaf-50 px-3 py-2 text-sm text-leaf-900">
          Published{view.published ? ` on ${view.published.at.toISOString().slice(0, 10)}` : ""}. Growers can read it in the library now:{" "}
          <Link href={`/library/${trial.id}`} className="underline">
            open it in the library
          </Link>
          .
        </p>
      )}
      {canEdit ? (
        <SummaryEditor trialId={trial.id} initialText={view.text} generatedText={view.generated.text} edited={view.edited} generatedChangedSinceEdit={view.generatedChangedSinceEdit} canPublish={canPublish} status={trial.status} />
      ) : (
        <div className="rounded border border-soil-200 bg-white p-4">
          <SummaryText text={view.text} />
        </div>
      )}
      {hazardous.map((method) => (
        <Cautions key={method.code} heading={`Safety: ${method.name} (${categoryNames[method.category].toLowerCase()})`} cautions={cautionsFor(method.category)} />
      ))}
      <div className="mt-8">
        <ResultsPanel numbers={view.numbers} />
      </div>
    </section>
  );
}
