"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";

/** The owner starts a complete draft: it becomes active and its layout is fixed. */
export function StatusPanel({ trialId, missing, warnings }: { trialId: string; missing: string[]; warnings: string[] }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function activate() {
    if (!window.confirm("Start the trial? Its treatments, design and plots can no longer change once it is active.")) return;
    setBusy(true);
    setError(null);
    const result = await callApi(`/api/trials/${trialId}/status`, { method: "POST", json: { status: "active" } });
    setBusy(false);
    if (!result.ok) {
      setError(result.error.message);
      return;
    }
    router.refresh();
  }

  return (
    <div className="space-y-2 text-sm" data-testid="status-panel">
      {missing.length > 0 ? (
        <>
          <p className="font-medium">Before the trial can start:</p>
          <ul className="list-disc pl-5">
            {missing.map((item) => (
              <li key={item}>{item}</li>
            ))}
          </ul>
        </>
      ) : (
        <p>The plan is complete. Once started, the layout is fixed and technicians can record data.</p>
      )}
      {warnings.map((warning) => (
        <p key={warning} role="note" className="rounded border border-amber-600 bg-amber-50 px-2 py-1 text-amber-900">
          {warning}
        </p>
      ))}
      {error && (
        <p role="alert" className="rounded bg-red-50 px-2 py-1 text-red-800">
          {error}
        </p>
      )}
      <Button type="button" onClick={activate} disabled={busy || missing.length > 0}>
        {busy ? "Starting…" : "Start the trial (make it active)"}
      </Button>
    </div>
  );
}
