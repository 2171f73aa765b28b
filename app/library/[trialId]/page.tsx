import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ResultsPanel } from "@/components/economics/ResultsPanel";
import { FollowButtons } from "@/components/library/FollowButtons";
import { Cautions } from "@/components/safety/Cautions";
import { SummaryText } from "@/components/summary/SummaryText";
import { can } from "@/lib/auth/permissions";
import { currentUser } from "@/lib/auth/session";
import { followsOf } from "@/lib/data/follows";
import { publishedTrial } from "@/lib/data/library";
import { summaryOf } from "@/lib/data/summaries";
import { cautionsFor } from "@/lib/safety/cautions";
import { categoryNames } from "@/lib/trials/labels";

export const metadata: Metadata = { title: "Published trial" };
export const dynamic = "force-dynamic";

export default async function PublishedTrialPage({ params }: { params: Promise<{ trialId: string }> }) {
  const { trialId } = await params;
  // Only published trials exist here, for everyone; a draft's id answers like an unknown one.
  const trial = await publishedTrial(trialId);
  if (!trial) notFound();
  const [view, user] = await Promise.all([summaryOf(trial), currentUser()]);
  const { input } = view.numbers;
  const hazardous = input.methods.filter((method) => method.checkType === null && cautionsFor(method.category).length > 0);
  const follows = user && can(user.role, "follow:manage") ? (await followsOf(user.id)).map((follow) => ({ id: follow.id, kind: follow.kind, value: follow.value })) : null;
  const categories = [...new Set(input.methods.filter((method) => method.checkType === null).map((method) => method.category))];

  return (
    <article>
      <p className="mb-1 text-sm">
        <Link href="/library" className="text-leaf-700 underline">
          ← Library
        </Link>
      </p>
      <h1 className="text-2xl font-semibold">{trial.title}</h1>
      <p className="text-sm text-soil-700">
        {input.trial.crop} · {input.trial.season} season · {input.trial.siteName}, {input.trial.region}
        {view.published && ` · published ${view.published.at.toISOString().slice(0, 10)}`}
      </p>
      <p className="mt-2 inline-block rounded border border-soil-200 bg-white px-2 py-1 text-xs text-soil-700">One trial at one site and season: evidence, not a recommendation.</p>

      <div className="mt-6 grid gap-8 lg:grid-cols-[3fr_2fr]">
        <SummaryText text={view.text} />
        <aside className="space-y-4">
          <section aria-labelledby="downloads-heading" className="rounded border border-soil-200 bg-white p-4 text-sm">
            <h2 id="downloads-heading" className="mb-2 font-semibold">Data and report</h2>
            <ul className="space-y-1">
              <li>
                <a href={`/api/library/${trial.id}/data`} className="text-leaf-700 underline" download>
                  Download the plot data (CSV)
                </a>
              </li>
              <li>
                <a href={`/api/library/${trial.id}/report`} className="text-leaf-700 underline" download>
                  Technical report (PDF)
                </a>{" "}
                <span className="text-soil-700">(statistics tables for advisers and researchers)</span>
              </li>
            </ul>
            {view.edited && <p className="mt-2 text-xs text-soil-700">The researcher edited the generated text; the numbers below are the ones it was generated from.</p>}
          </section>
          {follows ? (
            <FollowButtons crop={input.trial.crop} categories={categories} follows={follows} />
          ) : (
            !user && (
              <p className="rounded border border-soil-200 bg-white p-4 text-sm">
                <Link href="/signin" className="text-leaf-700 underline">Sign in</Link> or{" "}
                <Link href="/register" className="text-leaf-700 underline">create a grower account</Link> to hear when new {input.trial.crop.toLowerCase()} trials are published.
              </p>
            )
          )}
          {hazardous.map((method) => (
            <Cautions key={method.code} heading={`Safety: ${method.name} (${categoryNames[method.category].toLowerCase()})`} cautions={cautionsFor(method.category)} />
          ))}
        </aside>
      </div>

      <div className="mt-8">
        <ResultsPanel numbers={view.numbers} />
      </div>
    </article>
  );
}
