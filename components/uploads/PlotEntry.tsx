"use client";

import { useRouter } from "next/navigation";
import { useCallback, useEffect, useState } from "react";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";

export interface EntryAssessment {
  id: string;
  name: string;
  unit: string;
  quadratsPerPlot: number;
  plannedDate: string | null;
  current: Record<number, number>;
}

type SaveState = { kind: "clean" } | { kind: "unsaved" } | { kind: "saving" } | { kind: "saved"; version: number } | { kind: "waiting"; message: string } | { kind: "refused"; message: string };

const storageKey = (trialId: string, plotNumber: number, assessmentId: string) => `hoebench:entry:${trialId}:${plotNumber}:${assessmentId}`;

/**
 * Quadrat values for one plot, keyed on a phone in the field. What is typed is kept on the
 * phone until the server has it, so a dropped connection loses nothing; saving retries when
 * the phone comes back online.
 */
export function PlotEntry({ trialId, plotNumber, assessments, initialAssessmentId, needsReason }: { trialId: string; plotNumber: number; assessments: EntryAssessment[]; initialAssessmentId: string; needsReason: boolean }) {
  const router = useRouter();
  const [assessmentId, setAssessmentId] = useState(initialAssessmentId);
  const assessment = assessments.find((entry) => entry.id === assessmentId) ?? assessments[0];
  const [draft, setDraft] = useState<Record<number, string>>({});
  const [reason, setReason] = useState("");
  const [state, setState] = useState<SaveState>({ kind: "clean" });

  useEffect(() => {
    const kept = window.localStorage.getItem(storageKey(trialId, plotNumber, assessment.id));
    if (kept) {
      setDraft(JSON.parse(kept));
      setState({ kind: "unsaved" });
    } else {
      setDraft(Object.fromEntries(Object.entries(assessment.current).map(([quadrat, value]) => [quadrat, String(value)])));
      // A refresh after saving brings the saved values back: keep saying they were saved.
      setState((previous) => (previous.kind === "saved" ? previous : { kind: "clean" }));
    }
  }, [trialId, plotNumber, assessment]);

  function change(quadrat: number, text: string) {
    const next = { ...draft, [quadrat]: text };
    setDraft(next);
    window.localStorage.setItem(storageKey(trialId, plotNumber, assessment.id), JSON.stringify(next));
    setState({ kind: "unsaved" });
  }

  const save = useCallback(async () => {
    const values = [];
    for (let quadrat = 1; quadrat <= assessment.quadratsPerPlot; quadrat += 1) {
      const text = (draft[quadrat] ?? "").trim().replace(",", ".");
      if (text !== "" && !/^\d+(\.\d+)?$/.test(text)) {
        setState({ kind: "refused", message: `Quadrat ${quadrat}: "${draft[quadrat]}" is not a number of zero or more.` });
        return;
      }
      values.push({ quadrat, species: "", value: text === "" ? null : Number(text) });
    }
    setState({ kind: "saving" });
    const result = await callApi<{ number: number }>("/api/plot-entries", {
      method: "POST",
      json: { trialId, assessmentId: assessment.id, plotNumber, values, ...(needsReason ? { reason } : {}) },
    });
    if (result.ok) {
      window.localStorage.removeItem(storageKey(trialId, plotNumber, assessment.id));
      setState({ kind: "saved", version: result.data.number });
      router.refresh();
    } else if (result.error.code === "NETWORK" || result.error.code === "UNAVAILABLE" || result.error.code === "INTERNAL") {
      setState({ kind: "waiting", message: "No connection. Your values are kept on this phone; saving again when the connection returns." });
    } else {
      setState({ kind: "refused", message: result.error.message });
    }
  }, [assessment, draft, needsReason, plotNumber, reason, router, trialId]);

  useEffect(() => {
    if (state.kind !== "waiting") return;
    const retry = () => void save();
    window.addEventListener("online", retry);
    const timer = window.setInterval(retry, 15_000);
    return () => {
      window.removeEventListener("online", retry);
      window.clearInterval(timer);
    };
  }, [state.kind, save]);

  const status: Record<SaveState["kind"], string> = {
    clean: "Showing the saved values.",
    unsaved: "Not saved yet: kept on this phone.",
    saving: "Saving…",
    saved: state.kind === "saved" ? `Saved as version ${state.version}.` : "",
    waiting: state.kind === "waiting" ? state.message : "",
    refused: state.kind === "refused" ? state.message : "",
  };

  return (
    <section className="space-y-3 rounded border border-soil-200 bg-white p-4" aria-labelledby="entry-heading">
      <h2 id="entry-heading" className="text-lg font-semibold">
        Enter values
      </h2>
      <label className="block text-sm">
        <span className="mb-1 block font-medium">Assessment</span>
        <select value={assessment.id} onChange={(event) => setAssessmentId(event.target.value)} className="w-full rounded border border-soil-200 px-3 py-3 text-base">
          {assessments.map((entry) => (
            <option key={entry.id} value={entry.id}>
              {entry.name}
              {entry.plannedDate ? ` (${entry.plannedDate})` : ""}
            </option>
          ))}
        </select>
      </label>
      <p className="text-sm text-soil-700">Values in {assessment.unit}. Leave a quadrat empty if it was not assessed.</p>
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        {Array.from({ length: assessment.quadratsPerPlot }, (_, index) => index + 1).map((quadrat) => (
          <label key={quadrat} className="block text-sm">
            <span className="mb-1 block font-medium">{assessment.quadratsPerPlot === 1 ? "Value" : `Quadrat ${quadrat}`}</span>
            <input
              inputMode="decimal"
              autoComplete="off"
              value={draft[quadrat] ?? ""}
              onChange={(event) => change(quadrat, event.target.value)}
              className="w-full rounded border border-soil-200 px-3 py-3 text-lg tabular-nums"
            />
          </label>
        ))}
      </div>
      {needsReason && (
        <label className="block text-sm">
          <span className="mb-1 block font-medium">Why does locked data change? (the reviewer sees this)</span>
          <textarea value={reason} onChange={(event) => setReason(event.target.value)} className="w-full rounded border border-soil-200 p-2" rows={2} />
        </label>
      )}
      <p
        role={state.kind === "refused" ? "alert" : "status"}
        data-testid="entry-state"
        className={`rounded px-3 py-2 text-sm ${state.kind === "refused" ? "bg-red-50 text-red-800" : state.kind === "saved" ? "bg-leaf-50 text-leaf-900" : state.kind === "clean" ? "bg-soil-100" : "bg-amber-50 text-amber-900"}`}
      >
        {status[state.kind]}
      </p>
      <Button type="button" onClick={() => void save()} disabled={state.kind === "saving" || (needsReason && reason.trim() === "")} className="w-full py-3 text-base">
        Save plot {plotNumber}
      </Button>
    </section>
  );
}
