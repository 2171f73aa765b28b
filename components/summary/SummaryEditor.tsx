"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";
import { SummaryText } from "./SummaryText";

interface Props {
  trialId: string;
  initialText: string;
  generatedText: string;
  edited: boolean;
  canPublish: boolean;
  status: string;
}

/** Edit the generated words, preview them as growers will see them, save, and publish. */
export function SummaryEditor({ trialId, initialText, generatedText, edited: initiallyEdited, canPublish, status }: Props) {
  const router = useRouter();
  const [text, setText] = useState(initialText);
  const [saved, setSaved] = useState(initialText);
  const [edited, setEdited] = useState(initiallyEdited);
  const [message, setMessage] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [published, setPublished] = useState<string | null>(null);
  const dirty = text !== saved;

  async function save(next: string | null) {
    setBusy(true);
    const result = await callApi<{ text: string; edited: boolean }>(`/api/summaries/${trialId}`, { method: "PUT", json: { text: next } });
    setBusy(false);
    if (!result.ok) return setMessage({ tone: "error", text: result.error.fields?.[0]?.message ?? result.error.message });
    setText(result.data.text);
    setSaved(result.data.text);
    setEdited(result.data.edited);
    setMessage({ tone: "ok", text: next === null ? "Back to the generated text." : "Saved." });
  }

  async function publish() {
    setBusy(true);
    const result = await callApi<{ libraryUrl: string }>(`/api/summaries/${trialId}/publish`, { method: "POST", json: {} });
    setBusy(false);
    setConfirming(false);
    if (!result.ok) return setMessage({ tone: "error", text: result.error.message });
    setPublished(result.data.libraryUrl);
    setMessage({ tone: "ok", text: "Published. Growers can read it in the library now." });
    router.refresh();
  }

  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <div>
        <label htmlFor="summary-text" className="mb-1 block font-medium">
          Summary text
        </label>
        <p id="summary-help" className="mb-2 text-xs text-soil-700">
          Lines starting with “## ” are headings; a blank line starts a new paragraph. Keep the ranges and the “no clear difference” wording unless the results say otherwise.
        </p>
        <textarea
          id="summary-text"
          aria-describedby="summary-help"
          value={text}
          onChange={(event) => setText(event.target.value)}
          rows={22}
          className="w-full rounded border border-soil-200 bg-white p-2 font-mono text-sm"
        />
        <div className="mt-2 flex flex-wrap items-center gap-2">
          <Button type="button" disabled={busy || !dirty} onClick={() => save(text)}>
            Save text
          </Button>
          <Button type="button" variant="secondary" disabled={busy || (!edited && text === generatedText)} onClick={() => save(null)}>
            Reset to generated text
          </Button>
          <span className="text-xs text-soil-700">{edited ? "Edited by hand" : "Generated text"}{dirty ? " · unsaved changes" : ""}</span>
        </div>
        {message && (
          <p role={message.tone === "error" ? "alert" : "status"} className={`mt-2 text-sm ${message.tone === "error" ? "text-red-800" : "text-leaf-700"}`}>
            {message.text} {published && <Link href={published} className="underline">Open it in the library</Link>}
          </p>
        )}
        <div className="mt-4 rounded border border-soil-200 bg-white p-4">
          <h2 className="mb-1 font-semibold">Publish</h2>
          {canPublish && !published ? (
            confirming ? (
              <div className="space-y-2 text-sm">
                <p>Publishing makes the trial, this text and its data public and cannot be undone here. {dirty ? "Your unsaved changes will not be published; save first." : ""}</p>
                <div className="flex gap-2">
                  <Button type="button" disabled={busy || dirty} onClick={publish}>
                    Publish now
                  </Button>
                  <Button type="button" variant="secondary" onClick={() => setConfirming(false)}>
                    Not yet
                  </Button>
                </div>
              </div>
            ) : (
              <Button type="button" onClick={() => setConfirming(true)}>
                Publish to the library
              </Button>
            )
          ) : (
            <p className="text-sm text-soil-700">
              {published ? "Published." : status === "locked" ? "Only the trial's researcher publishes it." : "A trial is published once it is locked after the reviewer's sign-off."}
            </p>
          )}
        </div>
      </div>
      <div>
        <p className="mb-1 font-medium">Preview as growers see it</p>
        <div className="rounded border border-soil-200 bg-white p-4">
          <SummaryText text={text} />
        </div>
      </div>
    </div>
  );
}
