import type { AssessmentResults } from "@/lib/validations/analysis";
import { num } from "./format";

/** The means table for print: same columns as the sortable one, no interaction. */
export function StaticMeansTable({ results }: { results: AssessmentResults }) {
  const transformed = results.options.transform !== "none";
  const hasControl = results.means.some((mean) => mean.percentControl !== null);
  const hasWce = results.means.some((mean) => mean.weedControlEfficiency !== null);
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="report-means">
        <thead className="border-y border-soil-900">
          <tr>
            <th scope="col" className="px-2 py-1 text-left font-medium">Treatment</th>
            <th scope="col" className="px-2 py-1 text-right font-medium">n</th>
            <th scope="col" className="px-2 py-1 text-right font-medium">Mean ({results.assessment.unit})</th>
            {transformed && <th scope="col" className="px-2 py-1 text-right font-medium">Transformed</th>}
            <th scope="col" className="px-2 py-1 text-right font-medium">SE</th>
            <th scope="col" className="px-2 py-1 text-left font-medium">Group</th>
            {hasControl && <th scope="col" className="px-2 py-1 text-right font-medium">% control</th>}
            {hasWce && <th scope="col" className="px-2 py-1 text-right font-medium">WCE %</th>}
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {results.means.map((mean) => (
            <tr key={mean.treatment}>
              <td className="px-2 py-0.5">{mean.treatment} {mean.name}</td>
              <td className="px-2 py-0.5 text-right">{mean.n}</td>
              <td className="px-2 py-0.5 text-right">{num(mean.mean)}</td>
              {transformed && <td className="px-2 py-0.5 text-right">{num(mean.transformedMean)}</td>}
              <td className="px-2 py-0.5 text-right">{num(mean.se)}</td>
              <td className="px-2 py-0.5">{mean.letters ?? "–"}</td>
              {hasControl && <td className="px-2 py-0.5 text-right">{mean.percentControl === null ? "–" : num(mean.percentControl)}</td>}
              {hasWce && <td className="px-2 py-0.5 text-right">{mean.weedControlEfficiency === null ? "–" : num(mean.weedControlEfficiency)}</td>}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 border-t border-soil-900 pt-1 text-xs text-soil-700">{results.lettersNote}</p>
    </div>
  );
}
