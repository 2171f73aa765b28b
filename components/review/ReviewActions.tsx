"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { callApi } from "@/lib/client/api";

const buttonClass = "rounded bg-leaf-700 px-4 py-2 text-sm font-medium text-white hover:bg-leaf-800 disabled:opacity-50";
const secondaryButtonClass = "rounded border border-soil-300 bg-white px-4 py-2 text-sm font-medium text-soil-900 hover:bg-soil-50 disabled:opacity-50";
const inputClass = "mt-1 block w-full rounded border border-soil-300 bg-white px-2 py-1.5 text-sm";

/** Ask for review or withdraw the request (owner), or approve and lock (reviewer). */
export function ReviewActions({ trialId, mayRequest, mayWithdraw, mayApprove }: { trialId: string; mayRequest: boolean; mayWithdraw: boolean; mayApprove: boolean }) {
  const router = useRouter();
  const [text, setText] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!mayRequest && !mayWithdraw && !mayApprove) return null;

  async function withdraw() {
    setBusy(true);
    setError(null);
    const answer = await callApi(`/api/reviews/${trialId}/request`, { method: "DELETE" });
    setBusy(false);
    if (!answer.ok) return setError(answer.error.message);
    router.refresh();
  }

  async function send(kind: "request" | "approve") {
    setBusy(true);
    setError(null);
    const answer = await callApi(`/api/reviews/${trialId}/${kind}`, { method: "POST", json: kind === "request" ? { message: text } : { note: text } });
    setBusy(false);
    if (!answer.ok) return setError(answer.error.message);
    setText("");
    router.refresh();
  }

  return (
    <div className="space-y-2 rounded border border-soil-200 bg-white p-4">
      {(mayRequest || mayApprove) && (
        <label className="block text-sm">
          {mayApprove ? "Sign-off note (optional)" : "Message to the reviewers (optional)"}
          <textarea className={inputClass} rows={2} value={text} onChange={(event) => setText(event.target.value)} />
        </label>
      )}
      {mayRequest && (
        <button type="button" className={buttonClass} disabled={busy} onClick={() => send("request")}>
          Request review
        </button>
      )}
      {mayApprove && (
        <div className="space-y-1">
          <button type="button" className={buttonClass} disabled={busy} onClick={() => send("approve")}>
            Approve and lock the trial
          </button>
          <p className="text-xs text-soil-700">Approving locks the trial: its data become read-only and later changes need a reason, shown in the audit trail.</p>
        </div>
      )}
      {mayWithdraw && (
        <div className="space-y-1">
          <button type="button" className={secondaryButtonClass} disabled={busy} onClick={withdraw}>
            Withdraw the review request
          </button>
          <p className="text-xs text-soil-700">The reviewers can then no longer approve it; comments stay, and you can ask again later.</p>
        </div>
      )}
      {error && <p role="alert" className="text-sm text-red-800">{error}</p>}
    </div>
  );
}
