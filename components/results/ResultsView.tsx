"use client";

import { useEffect, useRef, useState } from "react";
import { AnovaTable } from "./AnovaTable";
import { MeansTable } from "./MeansTable";
import { BoxChart, EquivalenceChart, MeansChart, QqChart, ResidualChart } from "@/components/charts/ResultCharts";
import { callApi, type ApiFailure } from "@/lib/client/api";
import { alphaChoices, resultsQueryOf, type ResultsOptionsState } from "@/lib/analysis/results-options";
import { transformLabels, transforms, type AssessmentResults } from "@/lib/validations/analysis";
import { num, pText } from "./format";

const selectClass = "mt-1 block w-full rounded border border-soil-300 bg-white px-2 py-1.5 text-sm";

/**
 * An assessment's results, fetched in the browser so that changing an option only asks the
 * (cached) analysis API again; the page around it stays.
 */
export function ResultsView({ trialId, assessmentId, treatments, initial }: { trialId: string; assessmentId: string; treatments: { code: string; name: string }[]; initial: ResultsOptionsState }) {
  const [options, setOptions] = useState(initial);
  const [results, setResults] = useState<AssessmentResults | null>(null);
  const [error, setError] = useState<ApiFailure | null>(null);
  const [loading, setLoading] = useState(true);
  const request = useRef(0);
  const query = resultsQueryOf(options);

  // The address follows the options, so a reload or a shared link shows the same analysis.
  useEffect(() => {
    if (window.location.search !== `?${query}`) window.history.replaceState(null, "", `?${query}`);
  }, [query]);

  useEffect(() => {
    const id = ++request.current;
    setLoading(true);
    const timer = setTimeout(async () => {
      const answer = await callApi<AssessmentResults>(`/api/analysis/${trialId}/${assessmentId}?${query}`);
      if (id !== request.current) return;
      setLoading(false);
      if (answer.ok) {
        setResults(answer.data);
        setError(null);
      } else setError(answer.error);
    }, 120);
    return () => clearTimeout(timer);
  }, [trialId, assessmentId, query]);

  const set = (key: keyof ResultsOptionsState) => (event: React.ChangeEvent<HTMLSelectElement | HTMLInputElement>) => setOptions({ ...options, [key]: event.target.value });

  return (
    <div className="space-y-6">
      <form className="no-print grid grid-cols-2 gap-3 rounded border border-soil-200 bg-white p-3 sm:grid-cols-3 lg:grid-cols-6" aria-label="Analysis options" onSubmit={(event) => event.preventDefault()}>
        <label className="text-sm">
          Transform
          <select className={selectClass} value={options.transform} onChange={set("transform")}>
            {transforms.map((transform) => (
              <option key={transform} value={transform}>{transformLabels[transform]}</option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          Mean separation
          <select className={selectClass} value={options.method} onChange={set("method")}>
            <option value="lsd">Fisher&apos;s protected LSD</option>
            <option value="tukey">Tukey HSD</option>
          </select>
        </label>
        <label className="text-sm">
          Alpha
          <select className={selectClass} value={options.alpha} onChange={set("alpha")}>
            {alphaChoices.map((alpha) => (
              <option key={alpha} value={alpha}>{alpha}</option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          Control for % control
          <select className={selectClass} value={options.control} onChange={set("control")}>
            <option value="">None</option>
            {treatments.map((treatment) => (
              <option key={treatment.code} value={treatment.code}>{treatment.code} {treatment.name}</option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          Equivalence reference
          <select className={selectClass} value={options.reference} onChange={set("reference")}>
            <option value="">None</option>
            {treatments.map((treatment) => (
              <option key={treatment.code} value={treatment.code}>{treatment.code} {treatment.name}</option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          Margin (±)
          <input className={selectClass} type="number" min="0" step="any" inputMode="decimal" value={options.margin} onChange={set("margin")} disabled={!options.reference} />
        </label>
      </form>

      <p className="no-print text-sm text-soil-700" aria-live="polite" data-testid="results-status">
        {loading ? "Analysing…" : results ? `Data version ${results.dataVersion} · analysed ${results.computedAt.slice(0, 16).replace("T", " ")} UTC` : ""}
      </p>
      {error && (
        <p role="alert" className="rounded border border-red-300 bg-red-50 p-3 text-sm text-red-900">
          The results could not be loaded: {error.message}
        </p>
      )}
      {results && <ResultsBody results={results} />}
    </div>
  );
}

function ResultsBody({ results }: { results: AssessmentResults }) {
  if (results.empty) return <p className="rounded border border-dashed border-soil-300 bg-white p-6">No data have been recorded for this assessment yet.</p>;
  const transformed = results.options.transform !== "none";
  return (
    <div className="space-y-6" data-testid="results">
      {(results.warnings.length > 0 || results.error) && (
        <div role="status" className="rounded border border-amber-300 bg-amber-50 p-3 text-sm text-amber-950" data-testid="warnings">
          <p className="font-medium">Read with care</p>
          <ul className="ml-5 list-disc">
            {results.error && <li>{results.error}</li>}
            {results.warnings.map((warning) => (
              <li key={warning}>{warning}</li>
            ))}
          </ul>
        </div>
      )}
      {results.anova.length > 0 && (
        <section className="grid items-start gap-6 2xl:grid-cols-2 [&>*]:min-w-0">
          <AnovaTable anova={results.anova} cvPercent={results.cvPercent} grandMean={results.grandMean} lsd={results.lsd} alpha={results.options.alpha} unit={results.assessment.unit} transformed={transformed} />
          <MeansTable results={results} />
        </section>
      )}
      {results.means.length > 0 && (
        <section className="grid gap-4 lg:grid-cols-2 [&>*]:min-w-0" aria-label="Charts">
          <MeansChart results={results} />
          <BoxChart results={results} />
        </section>
      )}
      {results.diagnostics.points.length > 0 && (
        <section aria-labelledby="diagnostics-heading">
          <h2 id="diagnostics-heading" className="mb-2 text-lg font-semibold">Diagnostics</h2>
          <div className="grid gap-4 lg:grid-cols-3 [&>*]:min-w-0">
            <ResidualChart results={results} />
            <QqChart results={results} />
            <div className="rounded border border-soil-200 bg-white p-3 text-sm" data-testid="assumptions">
              <p>
                Shapiro-Wilk (residuals): {results.diagnostics.shapiroWilk ? `W = ${num(results.diagnostics.shapiroWilk.w, 4)}, ${pText(results.diagnostics.shapiroWilk.p)}` : "not computed"}
              </p>
              <p>
                Levene (Brown-Forsythe): {results.diagnostics.levene ? `F = ${num(results.diagnostics.levene.f)}, ${pText(results.diagnostics.levene.p)}` : "not computed"}
              </p>
              <p className="mt-2 font-medium">Recommendation</p>
              <ul className="ml-5 list-disc">
                {results.diagnostics.advice.map((advice) => (
                  <li key={advice}>{advice}</li>
                ))}
              </ul>
            </div>
          </div>
        </section>
      )}
      {results.equivalence && (
        <section aria-labelledby="equivalence-heading" data-testid="equivalence">
          <h2 id="equivalence-heading" className="mb-2 text-lg font-semibold">Equivalence to {results.equivalence.reference}</h2>
          <EquivalenceChart equivalence={results.equivalence} />
          <p className="mt-2 text-sm">{results.equivalence.conclusion}</p>
        </section>
      )}
    </div>
  );
}
