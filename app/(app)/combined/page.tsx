import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { AnovaTable } from "@/components/results/AnovaTable";
import { num, pText } from "@/components/results/format";
import { combinedAnalysis, combinedGroups } from "@/lib/analysis/combined";
import { can } from "@/lib/auth/permissions";
import { currentUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Combined analysis" };
export const dynamic = "force-dynamic";

export default async function CombinedPage({ searchParams }: { searchParams: Promise<{ group?: string; assessment?: string }> }) {
  const user = await currentUser();
  if (!user) redirect("/signin");
  const { group: groupKey, assessment } = await searchParams;
  const groups = can(user.role, "analysis:read") ? await combinedGroups(user) : [];
  const group = groups.find((entry) => entry.key === groupKey) ?? groups[0];
  const chosen = group && (group.assessments.includes(assessment ?? "") ? assessment! : group.assessments[0]);
  const result = group && chosen ? await combinedAnalysis(group, chosen) : null;
  return (
    <section className="space-y-6">
      <header>
        <h1 className="text-2xl font-semibold">Combined analysis over sites and years</h1>
        <p className="text-soil-700">Trials with the same treatment codes and the same assessment, analysed together: blocks within sites, and treatments tested against the site × treatment interaction.</p>
      </header>
      {groups.length === 0 && <p className="rounded border border-dashed border-soil-300 bg-white p-6">None of your trials share a protocol with another trial yet.</p>}
      {groups.map((entry) => (
        <nav key={entry.key} aria-label={`Trials with treatments ${entry.treatments.join(", ")}`} className="rounded border border-soil-200 bg-white p-3 text-sm">
          <p className="font-medium">Treatments {entry.treatments.join(", ")} at {entry.trials.map((trial) => `${trial.site} (${trial.season})`).join(" and ")}</p>
          <ul className="mt-1 flex flex-wrap gap-2">
            {entry.assessments.map((name) => (
              <li key={name}>
                <Link href={`/combined?group=${encodeURIComponent(entry.key)}&assessment=${encodeURIComponent(name)}`} aria-current={entry === group && name === chosen ? "page" : undefined} className={`inline-block rounded border px-2 py-1 ${entry === group && name === chosen ? "border-leaf-700 bg-leaf-50 font-medium" : "border-soil-200"}`}>
                  {name}
                </Link>
              </li>
            ))}
          </ul>
        </nav>
      ))}
      {result && (
        <section className="space-y-4" data-testid="combined-result">
          <h2 className="text-lg font-semibold">{result.assessment}</h2>
          {result.error && <p role="alert" className="rounded border border-red-300 bg-red-50 p-3 text-sm">{result.error}</p>}
          {result.siteByTreatment && (
            <p className="text-sm" data-testid="site-by-treatment">
              Site × treatment: F = {num(result.siteByTreatment.f)}, {pText(result.siteByTreatment.p)}.{" "}
              {result.siteByTreatment.p <= 0.05 ? "The treatments ranked differently between sites: read the per-site means before the combined ones." : "No evidence that the treatments ranked differently between sites; the combined means summarise both."}
            </p>
          )}
          {[...result.warnings, ...result.advice].length > 0 && (
            <ul className="ml-5 list-disc text-sm text-amber-900">{[...result.warnings, ...result.advice].map((line) => <li key={line}>{line}</li>)}</ul>
          )}
          {result.anova.length > 0 && <AnovaTable anova={result.anova} cvPercent={null} grandMean={null} lsd={null} alpha={0.05} unit={result.unit} transformed={false} summary={false} />}
          <div className="overflow-x-auto rounded border border-soil-200 bg-white">
            <table className="w-full text-sm">
              <caption className="px-3 py-2 text-left font-medium">Means per site and combined ({result.unit}); letters: Tukey HSD, α = 0.05</caption>
              <thead className="border-y border-soil-900">
                <tr>
                  <th scope="col" className="px-3 py-1 text-left font-medium">Treatment</th>
                  {result.perSite.map((site) => <th key={site.site} scope="col" className="px-3 py-1 text-right font-medium">{site.site}</th>)}
                  <th scope="col" className="px-3 py-1 text-right font-medium">Combined</th>
                  <th scope="col" className="px-3 py-1 text-left font-medium">Group</th>
                </tr>
              </thead>
              <tbody className="tabular-nums">
                {result.means.map((mean) => (
                  <tr key={mean.treatment}>
                    <th scope="row" className="px-3 py-1 text-left font-normal">{mean.treatment}</th>
                    {result.perSite.map((site) => <td key={site.site} className="px-3 py-1 text-right">{num(site.means[mean.treatment])}</td>)}
                    <td className="px-3 py-1 text-right">{num(mean.mean)} ± {num(mean.se)}</td>
                    <td className="px-3 py-1">{mean.group}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      )}
    </section>
  );
}
