import type { AssessmentResults } from "@/lib/validations/analysis";
import { num, pValue, sourceLabels } from "./format";

type Row = AssessmentResults["anova"][number];

/** The analysis of variance as published: source, df, SS, MS, F, Pr > F, then CV, grand mean and LSD. */
export function AnovaTable({ anova, cvPercent, grandMean, lsd, alpha, unit, transformed, summary = true }: { anova: Row[]; cvPercent: number | null; grandMean: number | null; lsd: number | null; alpha: number; unit: string; transformed: boolean; summary?: boolean }) {
  const total = anova.reduce((sum, row) => ({ df: sum.df + row.df, ss: sum.ss + row.ss }), { df: 0, ss: 0 });
  return (
    <div className="overflow-x-auto rounded border border-soil-200 bg-white">
      <table className="w-full text-sm" data-testid="anova-table">
        <caption className="px-3 py-2 text-left text-sm font-medium">Analysis of variance{transformed ? " (transformed scale)" : ""}</caption>
        <thead className="border-y border-soil-900">
          <tr>
            <th scope="col" className="px-3 py-1.5 text-left font-medium">Source</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">df</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">SS</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">MS</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">F</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">Pr &gt; F</th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {anova.map((row) => (
            <tr key={row.source}>
              <th scope="row" className="px-3 py-1 text-left font-normal">{sourceLabels[row.source] ?? row.source}</th>
              <td className="px-3 py-1 text-right">{row.df}</td>
              <td className="px-3 py-1 text-right">{num(row.ss, 4)}</td>
              <td className="px-3 py-1 text-right">{num(row.ms, 4)}</td>
              <td className="px-3 py-1 text-right">{row.f === undefined ? "" : num(row.f)}</td>
              <td className="px-3 py-1 text-right">{pValue(row.p)}</td>
            </tr>
          ))}
          <tr className="border-t border-soil-300">
            <th scope="row" className="px-3 py-1 text-left font-normal">Total</th>
            <td className="px-3 py-1 text-right">{total.df}</td>
            <td className="px-3 py-1 text-right">{num(total.ss, 4)}</td>
            <td colSpan={3} />
          </tr>
        </tbody>
        {summary && (
        <tfoot className="border-t border-soil-900 text-soil-700">
          <tr>
            <td colSpan={6} className="px-3 py-1.5">
              CV = {num(cvPercent)}% · Grand mean = {num(grandMean)} {transformed ? "(transformed)" : unit} · LSD ({alpha}) ={" "}
              {lsd === null ? "not given (unbalanced)" : num(lsd)}
            </td>
          </tr>
        </tfoot>
        )}
      </table>
    </div>
  );
}
