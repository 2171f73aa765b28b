"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState, useTransition } from "react";
import { Button } from "@/components/ui/Button";
import { DataTable, type DataColumn } from "@/components/ui/DataTable";
import { callApi } from "@/lib/client/api";
import type { CheckedUploadBody } from "@/lib/uploads/schemas";
import { putWithProgress } from "./put-with-progress";
import { ProblemList } from "./ProblemList";

type Stage =
  | { kind: "idle" }
  | { kind: "sending"; fraction: number }
  | { kind: "checking" }
  | { kind: "checked"; result: CheckedUploadBody }
  | { kind: "committing"; result: CheckedUploadBody }
  | { kind: "committed"; version: number };

type PreviewRow = CheckedUploadBody["preview"][number];

const columns: DataColumn<PreviewRow>[] = [
  { id: "row", header: "Row", value: (row) => row.row, align: "right" },
  { id: "plot", header: "Plot", value: (row) => row.plotNumber, align: "right" },
  { id: "quadrat", header: "Quadrat", value: (row) => row.quadrat, align: "right" },
  { id: "species", header: "Species", value: (row) => row.species || null },
  { id: "value", header: "Value", value: (row) => row.value, align: "right" },
];

export function UploadPanel({ trialId, assessmentId, unit, needsReason, maxMegabytes }: { trialId: string; assessmentId: string; unit: string; needsReason: boolean; maxMegabytes: number }) {
  const router = useRouter();
  const [stage, setStage] = useState<Stage>({ kind: "idle" });
  // The page's values are read again after a save; until they arrive they are the old ones.
  const [refreshing, startRefresh] = useTransition();
  const [error, setError] = useState<string | null>(null);
  const [reason, setReason] = useState("");

  async function send(file: File) {
    setError(null);
    if (file.size > maxMegabytes * 1024 * 1024) {
      setError(`The file is larger than ${maxMegabytes} MB, the most one upload may be.`);
      return;
    }
    setStage({ kind: "sending", fraction: 0 });
    const started = await callApi<{ uploadId: string; putUrl: string; contentType: string }>("/api/uploads", {
      method: "POST",
      json: { trialId, assessmentId, fileName: file.name, sizeBytes: file.size },
    });
    if (!started.ok) {
      setStage({ kind: "idle" });
      setError(started.error.fields?.[0]?.message ?? started.error.message);
      return;
    }
    try {
      await putWithProgress(started.data.putUrl, file, started.data.contentType, (fraction) => setStage({ kind: "sending", fraction }));
    } catch {
      setStage({ kind: "idle" });
      setError("The file could not be sent to storage. Nothing was recorded; try again.");
      return;
    }
    setStage({ kind: "checking" });
    const checked = await callApi<CheckedUploadBody>(`/api/uploads/${started.data.uploadId}/check`, { method: "POST" });
    if (!checked.ok) {
      setStage({ kind: "idle" });
      setError(checked.error.message);
      return;
    }
    setStage({ kind: "checked", result: checked.data });
  }

  async function commit(result: CheckedUploadBody) {
    setError(null);
    setStage({ kind: "committing", result });
    const committed = await callApi<{ number: number }>(`/api/uploads/${result.uploadId}/commit`, { method: "POST", json: needsReason ? { reason } : {} });
    if (!committed.ok) {
      setStage({ kind: "checked", result });
      setError(committed.error.fields?.[0]?.message ?? committed.error.message);
      return;
    }
    setStage({ kind: "committed", version: committed.data.number });
    startRefresh(() => router.refresh());
  }

  const result = stage.kind === "checked" || stage.kind === "committing" ? stage.result : null;
  const flaggedRows = useMemo(() => new Set(result?.problems.map((problem) => problem.row).filter(Boolean)), [result]);

  return (
    <section className="space-y-3 rounded border border-soil-200 bg-white p-4" aria-labelledby="upload-heading">
      <h2 id="upload-heading" className="font-semibold">
        Upload a data file
      </h2>
      <p className="text-sm text-soil-700">
        The data sheet saved as CSV: <code>plot, quadrat, species, value</code> (one row per quadrat) or <code>plot, q1, q2, …</code> (one
        column per quadrat). Values in {unit}. Uploading again makes a new version; earlier versions are kept.
      </p>
      <label className="block text-sm">
        <span className="mb-1 block font-medium">CSV file</span>
        <input
          type="file"
          accept=".csv,text/csv"
          disabled={stage.kind === "sending" || stage.kind === "checking" || stage.kind === "committing"}
          onChange={(event) => {
            const file = event.currentTarget.files?.[0];
            if (file) void send(file);
            event.currentTarget.value = "";
          }}
          className="block w-full text-sm file:mr-3 file:rounded file:border-0 file:bg-leaf-600 file:px-3 file:py-2 file:text-white"
        />
      </label>
      {stage.kind === "sending" && (
        <div>
          <progress max={1} value={stage.fraction} className="h-3 w-full" aria-label="Upload progress" />
          <p className="text-xs text-soil-700">Sending… {Math.round(stage.fraction * 100)}%</p>
        </div>
      )}
      {stage.kind === "checking" && <p role="status" className="text-sm">Checking every row…</p>}
      {error && (
        <p role="alert" className="rounded bg-red-50 px-3 py-2 text-sm text-red-800">
          {error}
        </p>
      )}
      {stage.kind === "committed" && (
        <p role="status" className="rounded bg-leaf-50 px-3 py-2 text-sm text-leaf-900">
          Saved as version {stage.version}. {refreshing ? "Updating the values below…" : "The values below are up to date."}
        </p>
      )}
      {result && (
        <div className="space-y-3" data-testid="upload-preview">
          <p className="text-sm">
            {result.rowCount} rows read ({result.format === "wide" ? "one column per quadrat" : "one row per quadrat"}):{" "}
            <strong>{result.errors}</strong> error{result.errors === 1 ? "" : "s"}, <strong>{result.warnings}</strong> to check. Against the
            current data: {result.changes.added} new, {result.changes.changed} changed, {result.changes.unchanged} unchanged,{" "}
            {result.changes.removed} no longer present.
          </p>
          <ProblemList problems={result.problems} />
          {result.preview.length > 0 && (
            <div className="max-h-96 overflow-y-auto">
            <DataTable
              rows={result.preview}
              columns={columns}
              rowKey={(row) => String(row.row) + row.species}
              rowClassName={(row) => (flaggedRows.has(row.row) ? "bg-amber-50" : "")}
              caption={result.preview.length < result.rowCount ? `First ${result.preview.length} values` : "Values to be saved"}
            />
            </div>
          )}
          {result.errors > 0 ? (
            <p className="text-sm text-red-800">Nothing has been saved. Fix the errors in your file and upload it again.</p>
          ) : (
            <div className="space-y-2">
              {needsReason && (
                <label className="block text-sm">
                  <span className="mb-1 block font-medium">Why does locked data change? (the reviewer sees this)</span>
                  <textarea value={reason} onChange={(event) => setReason(event.target.value)} className="w-full rounded border border-soil-200 p-2" rows={2} />
                </label>
              )}
              <Button type="button" onClick={() => void commit(result)} disabled={stage.kind === "committing" || (needsReason && reason.trim().length === 0)}>
                {stage.kind === "committing" ? "Saving…" : "Confirm and save as a new version"}
              </Button>
            </div>
          )}
        </div>
      )}
    </section>
  );
}
