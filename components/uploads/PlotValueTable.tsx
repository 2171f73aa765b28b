"use client";

import { DataTable, type DataColumn } from "@/components/ui/DataTable";
import type { PlotValueRow } from "@/lib/data/assessment-data";

const format = (value: number) => (Math.abs(value) >= 100 ? value.toFixed(1) : value.toPrecision(3));

const columns: DataColumn<PlotValueRow>[] = [
  { id: "plot", header: "Plot", value: (row) => row.plotNumber, align: "right" },
  { id: "block", header: "Block", value: (row) => row.block, align: "right" },
  { id: "treatment", header: "Treatment", value: (row) => row.treatmentCode, cell: (row) => <span title={row.treatmentName}>{row.treatmentCode}</span> },
  { id: "quadrats", header: "Quadrats", value: (row) => row.quadrats, align: "right" },
  { id: "raw", header: "Mean recorded", value: (row) => row.rawMean, cell: (row) => format(row.rawMean), align: "right" },
  { id: "value", header: "Plot value", value: (row) => row.value, cell: (row) => `${format(row.value)} ${row.unit}`, align: "right" },
  {
    id: "customary",
    header: "US units",
    value: (row) => row.customary?.value ?? null,
    cell: (row) => (row.customary ? `${format(row.customary.value)} ${row.customary.unit}` : "–"),
    align: "right",
  },
];

export function PlotValueTable({ rows }: { rows: PlotValueRow[] }) {
  return <DataTable rows={rows} columns={columns} rowKey={(row) => String(row.plotNumber)} emptyText="No values yet." />;
}
