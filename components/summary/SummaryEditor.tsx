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
  /** The edit was made before the results last changed: its numbers may be out of date. */
  generatedChangedSinceEdit: boolean;
  canPublish: boolean;
  status: string;
}

/** Edit the generated words, preview them as growers will see them, save, and publish. */
export function SummaryEditor({ trialId, initialText, generatedText: initialGenerated, edited: initiallyEdited, generatedChangedSinceEdit, canPublish, status }: Props) {
  const router = useRouter();
  const [text, setText] = useState(initialText);
  const [saved, setSaved] = useState(initialText);
  const [edited, setEdited] = useState(initiallyEdited);
  const [generatedText, setGeneratedText] = useState(initialGenerated);
  const [stale, setStale] = useState(generatedChangedSinceEdit);
  // The generated text the words in the box were written against; unknown (null) while a stale edit is unresolved.
  const [basedOn, setBasedOn] = useState<string | null>(generatedChangedSinceEdit ? null : initialGenerated);
  const [message, setMessage] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [published, setPublished] = useState<string | null>(null);
  const dirty = text !== saved;

  async function save(next: string | null, against: string | null = basedOn) {
    setBusy(true);
    const json = next !== null && against !== null ? { text: next, basedOn: against } : { text: next };
    const result = await callApi<{ text: string; generatedText: string; edited: boolean; generatedChangedSinceEdit: boolean }>(`/api/summaries/${trialId}`, { method: "PUT", json });
    setBusy(false);
    if (!result.ok) return setMessage({ tone: "error", text: result.error.fields?.[0]?.message ?? result.error.message });
    setText(result.data.text);
    setSaved(result.data.text);
    setEdited(result.data.edited);
    setGeneratedText(result.data.generatedText);
    setStale(result.data.generatedChangedSinceEdit);
    setBasedOn(result.data.generatedChangedSinceEdit ? null : result.data.generatedText);
    setMessage({ tone: "ok", text: next === null ? "Back to the generated text." : "Saved." });
  }

  function takeNewGeneratedText() {
    setText(generatedText);
    setBasedOn(generatedText);
    setMessage({ tone: "ok", text: "The new generated text is in the box. Add back any changes of your own, then save." });
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
        {stale && (
          <div role="alert" className="mb-3 rounded border-2 border-amber-700 bg-amber-50 p-3 text-sm text-amber-900" data-testid="summary-stale">
            <p className="font-semibold">The generated text has changed since this summary was edited.</p>
            <p className="mt-1">
              The trial’s data or results changed after the edit, so the edited text may quote numbers that no longer hold. Compare it with the new generated text before publishing.
            </p>
            <details className="mt-2">
              <summary className="cursor-pointer underline">Show the new generated text</summary>
              <div className="mt-2 rounded border border-soil-200 bg-white p-3 text-soil-900">
                <SummaryText text={generatedText} />
              </div>
            </details>
            <div className="mt-2 flex flex-wrap gap-2">
              <Button type="button" disabled={busy} onClick={takeNewGeneratedText}>
                Take the new generated text
              </Button>
              <Button type="button" variant="secondary" disabled={busy} onClick={() => save(text, generatedText)}>
                Keep my text: I have checked its numbers
              </Button>
            </div>
          </div>
        )}
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
          {canPublish && !published && stale ? (
            <p className="text-sm text-soil-700">Publishing waits until the edited text has been checked against the new results (see the warning above).</p>
          ) : canPublish && !published ? (
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
