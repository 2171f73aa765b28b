"use client";

import { DataTable, type DataColumn } from "@/components/ui/DataTable";
import type { AssessmentResults } from "@/lib/validations/analysis";
import { num } from "./format";

type Mean = AssessmentResults["means"][number];

export function MeansTable({ results }: { results: AssessmentResults }) {
  const transformed = results.options.transform !== "none";
  const columns: DataColumn<Mean>[] = [
    { id: "treatment", header: "Treatment", value: (row) => row.treatment, cell: (row) => <span><span className="font-medium">{row.treatment}</span> <span className="text-soil-700">{row.name}</span></span> },
    { id: "n", header: "n", value: (row) => row.n, align: "right" },
    { id: "mean", header: transformed ? `Mean (${results.assessment.unit}, back-tr.)` : `Mean (${results.assessment.unit})`, value: (row) => row.mean, cell: (row) => num(row.mean), align: "right" },
    ...(transformed ? [{ id: "transformed", header: "Transformed mean", value: (row: Mean) => row.transformedMean, cell: (row: Mean) => num(row.transformedMean), align: "right" as const }] : []),
    { id: "se", header: "SE", value: (row) => row.se, cell: (row) => num(row.se), align: "right" },
    { id: "letters", header: "Group", value: (row) => row.letters, cell: (row) => <span data-testid="letters">{row.letters ?? "–"}</span>, sortable: true },
  ];
  if (results.means.some((row) => row.percentControl !== null)) {
    columns.push({ id: "control", header: `% control (vs ${results.options.control})`, value: (row) => row.percentControl, cell: (row) => (row.percentControl === null ? "–" : num(row.percentControl, 3)), align: "right" });
  }
  if (results.means.some((row) => row.weedControlEfficiency !== null)) {
    columns.push({ id: "wce", header: "WCE %", value: (row) => row.weedControlEfficiency, cell: (row) => (row.weedControlEfficiency === null ? "–" : num(row.weedControlEfficiency, 3)), align: "right" });
  }
  return (
    <div data-testid="means-table">
      {/* Remounted when the column set changes (a transform or control added), so the table never keeps a stale column model. */}
      <DataTable key={columns.map((column) => column.id).join(",")} rows={results.means} columns={columns} rowKey={(row) => row.treatment} caption="Treatment means" />
      <p className="mt-2 text-xs text-soil-700" data-testid="letters-note">
        {results.lettersNote} SE: standard error of the {results.lsd === null ? "least-squares " : ""}mean{transformed ? " on the transformed scale" : ""}.
        {results.means.some((row) => row.percentControl !== null) ? ` Percent control = 100 × (1 − treatment mean / ${results.options.control} mean), from untransformed means.` : ""}
        {results.means.some((row) => row.weedControlEfficiency !== null) ? " WCE: weed control efficiency from weed dry matter." : ""}
      </p>
    </div>
  );
}
