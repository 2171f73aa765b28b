"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { callApi } from "@/lib/client/api";

export interface CommentItem {
  id: string;
  parentId: string | null;
  author: string;
  authorRole: string;
  body: string;
  createdAt: string;
  resolvedAt: string | null;
  resolvedBy: string | null;
}

const inputClass = "block w-full rounded border border-soil-300 bg-white px-2 py-1.5 text-sm";
const smallButton = "rounded border border-soil-300 px-2 py-1 text-xs hover:bg-soil-100 disabled:opacity-50";

function CommentForm({ trialId, assessmentId, parentId, label, onDone }: { trialId: string; assessmentId: string | null; parentId: string | null; label: string; onDone?: () => void }) {
  const router = useRouter();
  const [body, setBody] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    const answer = await callApi(`/api/reviews/${trialId}/comments`, { method: "POST", json: { body, assessmentId, parentId } });
    setBusy(false);
    if (!answer.ok) return setError(answer.error.fields?.[0]?.message ?? answer.error.message);
    setBody("");
    setError(null);
    onDone?.();
    router.refresh();
  }
  return (
    <form onSubmit={submit} className="space-y-1">
      <label className="block text-sm">
        <span className="sr-only">{label}</span>
        <textarea className={inputClass} rows={2} placeholder={label} aria-label={label} value={body} onChange={(event) => setBody(event.target.value)} />
      </label>
      {error && <p role="alert" className="text-xs text-red-800">{error}</p>}
      <button type="submit" className={smallButton} disabled={busy || body.trim() === ""}>
        {parentId ? "Reply" : "Add comment"}
      </button>
    </form>
  );
}

/** Comment threads of one assessment (or the whole trial): replies under their first comment, resolvable. */
export function CommentThreads({
  trialId,
  assessmentId,
  comments,
  mayComment,
  viewerName,
}: {
  trialId: string;
  assessmentId: string | null;
  comments: CommentItem[];
  mayComment: boolean;
  viewerName: string;
}) {
  const router = useRouter();
  // The answer of a resolve is shown at once: a page refresh still in flight from an earlier
  // action could otherwise bring back the state from before it.
  const [decided, setDecided] = useState<Record<string, boolean>>({});
  const [resolveError, setResolveError] = useState<string | null>(null);
  const threads = comments.filter((comment) => comment.parentId === null);
  const isResolved = (thread: CommentItem) => decided[thread.id] ?? Boolean(thread.resolvedAt);
  const resolverOf = (thread: CommentItem) => (thread.id in decided && decided[thread.id] && !thread.resolvedAt ? viewerName : thread.resolvedBy);
  async function resolve(id: string, resolved: boolean) {
    const answer = await callApi(`/api/reviews/${trialId}/comments/${id}`, { method: "PATCH", json: { resolved } });
    if (!answer.ok) return setResolveError(answer.error.message);
    setResolveError(null);
    setDecided((current) => ({ ...current, [id]: resolved }));
    router.refresh();
  }
  return (
    <div className="space-y-3">
      {threads.length === 0 && <p className="text-sm text-soil-700">No comments yet.</p>}
      {threads.map((thread) => (
        <article key={thread.id} className={`rounded border p-3 ${isResolved(thread) ? "border-soil-200 bg-soil-50" : "border-amber-300 bg-white"}`} data-testid="comment-thread">
          {[thread, ...comments.filter((comment) => comment.parentId === thread.id)].map((comment) => (
            <div key={comment.id} className={comment.parentId ? "ml-4 mt-2 border-l-2 border-soil-200 pl-3" : ""}>
              <p className="text-xs text-soil-700">
                {comment.author} ({comment.authorRole}) · {comment.createdAt.slice(0, 16).replace("T", " ")} UTC
              </p>
              <p className="whitespace-pre-wrap text-sm">{comment.body}</p>
            </div>
          ))}
          <div className="mt-2 flex flex-wrap items-center gap-2">
            {isResolved(thread) ? <span className="text-xs text-leaf-700">Resolved by {resolverOf(thread)}</span> : <span className="text-xs text-amber-800">Open</span>}
            {mayComment && (
              <button type="button" className={smallButton} onClick={() => resolve(thread.id, !isResolved(thread))}>
                {isResolved(thread) ? "Reopen" : "Resolve"}
              </button>
            )}
          </div>
          {mayComment && !isResolved(thread) && (
            <div className="mt-2">
              <CommentForm trialId={trialId} assessmentId={assessmentId} parentId={thread.id} label="Reply" />
            </div>
          )}
        </article>
      ))}
      {resolveError && <p role="alert" className="text-xs text-red-800">{resolveError}</p>}
      {mayComment && <CommentForm trialId={trialId} assessmentId={assessmentId} parentId={null} label="New comment" />}
    </div>
  );
}
