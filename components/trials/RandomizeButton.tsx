"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";

/** One click: a new stored seed and a new layout (drafts only; the server checks again). */
export function RandomizeButton({ trialId, hasLayout }: { trialId: string; hasLayout: boolean }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);

  async function randomize() {
    setBusy(true);
    setMessage(null);
    const result = await callApi<{ seed: number; plots: number }>(`/api/trials/${trialId}/randomize`, { method: "POST", json: { newSeed: hasLayout } });
    setBusy(false);
    if (!result.ok) {
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    setMessage({ kind: "ok", text: `Seed ${result.data.seed}: ${result.data.plots} plots laid out.` });
    router.refresh();
  }

  return (
    <div className="no-print flex flex-wrap items-center gap-3">
      <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={randomize} disabled={busy}>
        {busy ? "Randomizing…" : hasLayout ? "Re-randomize with a new seed" : "Randomize the layout"}
      </Button>
      {message && (
        <span role={message.kind === "error" ? "alert" : "status"} className={`text-sm ${message.kind === "error" ? "text-red-700" : "text-leaf-900"}`}>
          {message.text}
        </span>
      )}
    </div>
  );
}
