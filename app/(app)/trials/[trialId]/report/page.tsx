import type { Metadata } from "next";
import { PlotMap } from "@/components/field/PlotMap";
import { AnovaTable } from "@/components/results/AnovaTable";
import { StaticMeansTable } from "@/components/results/StaticMeansTable";
import { PrintButton } from "@/components/trials/PrintButton";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { TrialTabs } from "@/components/trials/TrialTabs";
import { can } from "@/lib/auth/permissions";
import { reviewStatusText } from "@/lib/data/reviews";
import { meansChartSvg } from "@/lib/reports/means-svg";
import { trialReport } from "@/lib/reports/report-data";
import { designNames } from "@/lib/trials/labels";
import { trialForPage } from "@/lib/trials/page-access";
import { analysisOptionsSchema } from "@/lib/validations/analysis";

export const metadata: Metadata = { title: "Technical report" };
export const dynamic = "force-dynamic";

export default async function ReportPage({ params, searchParams }: { params: Promise<{ trialId: string }>; searchParams: Promise<Record<string, string>> }) {
  const { trialId } = await params;
  const { user, trial } = await trialForPage(trialId, "analysis:read");
  const parsed = analysisOptionsSchema.safeParse(await searchParams);
  const report = await trialReport(trial, parsed.success ? parsed.data : {});
  const { overview, treatments, plan, sections, review } = report;
  const query = new URLSearchParams({ transform: report.options.transform, method: report.options.method, alpha: String(report.options.alpha), ...(report.options.control ? { control: report.options.control } : {}) }).toString();
  return (
    <article className="space-y-6 print:text-[11pt]" data-testid="report">
      <TrialHeading title={`Technical report: ${trial.title}`} status={trial.status} lines={[`${trial.crop} · ${trial.season} · ${overview.site.name}`]} />
      <TrialTabs trialId={trial.id} current="report" canPlan={can(user.role, "trial:edit")} />
      <div className="no-print flex flex-wrap gap-2 text-sm">
        <PrintButton label="Print report" />
        <a className="rounded border border-soil-200 bg-white px-4 py-2 font-medium hover:bg-soil-100" href={`/api/reports/${trial.id}/pdf?${query}`}>Download PDF</a>
        <a className="rounded border border-soil-200 bg-white px-4 py-2 font-medium hover:bg-soil-100" href={`/api/reports/${trial.id}/export?format=csv&${query}`}>All results (CSV)</a>
        <a className="rounded border border-soil-200 bg-white px-4 py-2 font-medium hover:bg-soil-100" href={`/api/reports/${trial.id}/export?format=json&${query}`}>All results (JSON)</a>
      </div>

      <section className="break-inside-avoid">
        <h2 className="text-lg font-semibold">Trial</h2>
        <p className="text-sm">{trial.objective}</p>
        <dl className="mt-2 grid grid-cols-1 gap-x-6 text-sm sm:grid-cols-2">
          <div><dt className="inline font-medium">Site: </dt><dd className="inline">{overview.site.name}, {overview.site.location} ({overview.site.region}); {overview.site.soil}</dd></div>
          <div><dt className="inline font-medium">Researcher: </dt><dd className="inline">{overview.ownerName}</dd></div>
          <div><dt className="inline font-medium">Design: </dt><dd className="inline">{designNames[trial.design]}, {trial.blocks} {trial.design === "crd" ? "replicates" : "blocks"}, plots {trial.plotLengthM} × {trial.plotWidthM} m</dd></div>
          <div><dt className="inline font-medium">Planting: </dt><dd className="inline">{trial.plantingDate ?? "not recorded"}</dd></div>
        </dl>
      </section>

      <section className="break-inside-avoid">
        <h2 className="text-lg font-semibold">Treatments</h2>
        <table className="w-full text-sm">
          <thead className="border-y border-soil-900"><tr><th className="px-2 py-1 text-left font-medium">Code</th><th className="px-2 py-1 text-left font-medium">Treatment</th><th className="px-2 py-1 text-left font-medium">Timing</th><th className="hidden px-2 py-1 text-left font-medium sm:table-cell">Settings</th></tr></thead>
          <tbody>
            {treatments.map((treatment) => (
              <tr key={treatment.id}><td className="px-2 py-0.5">{treatment.code}</td><td className="px-2 py-0.5">{treatment.name}</td><td className="px-2 py-0.5">{treatment.timing}</td><td className="hidden px-2 py-0.5 sm:table-cell">{treatment.rateOrSettings}</td></tr>
            ))}
          </tbody>
        </table>
      </section>

      {plan.plots.length > 0 && (
        <section className="break-inside-avoid">
          <h2 className="text-lg font-semibold">Plot map</h2>
          <div className="overflow-x-auto">
            <PlotMap title={plan.title} plots={plan.plots} treatments={plan.treatments} plotLengthM={plan.plotLengthM} plotWidthM={plan.plotWidthM} design={plan.design} serpentine={plan.serpentine} showWalkingOrder={false} />
          </div>
        </section>
      )}

      <section>
        <h2 className="text-lg font-semibold">Methods</h2>
        <p className="text-sm" data-testid="methods">{report.methods}</p>
      </section>

      {sections.map(({ assessment, results }) => (
        <section key={assessment.id} className="space-y-3 break-before-page" data-testid="report-assessment">
          <h2 className="text-lg font-semibold">{assessment.name}</h2>
          {results.empty ? (
            <p className="text-sm text-soil-700">No data were recorded.</p>
          ) : (
            <>
              {results.warnings.length > 0 && (
                <ul className="ml-5 list-disc text-xs text-amber-900">{results.warnings.map((warning) => <li key={warning}>{warning}</li>)}</ul>
              )}
              <div className="grid items-start gap-4 lg:grid-cols-2 print:grid-cols-1 [&>*]:min-w-0">
                <AnovaTable anova={results.anova} cvPercent={results.cvPercent} grandMean={results.grandMean} lsd={results.lsd} alpha={results.options.alpha} unit={results.assessment.unit} transformed={results.options.transform !== "none"} />
                <StaticMeansTable results={results} />
              </div>
              <div className="max-w-xl" dangerouslySetInnerHTML={{ __html: meansChartSvg(results) }} />
            </>
          )}
        </section>
      ))}

      <section className="break-inside-avoid rounded border border-soil-300 p-4" data-testid="sign-off">
        <h2 className="text-lg font-semibold">Reviewer&apos;s sign-off</h2>
        {review?.status === "approved" ? (
          <p className="text-sm">Approved by {review.decidedBy} on {new Date(review.decidedAt!).toISOString().slice(0, 10)}.{review.decisionNote ? ` “${review.decisionNote}”` : ""}</p>
        ) : (
          <p className="text-sm">{reviewStatusText[review?.status ?? "none"]}: these results have not been signed off.</p>
        )}
        <p className="mt-1 text-xs text-soil-700">Report generated {report.generatedAt.slice(0, 16).replace("T", " ")} UTC with Hoebench {report.version}.</p>
      </section>
    </article>
  );
}
