"use client";

import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { callApi, fieldErrors as toFieldErrors } from "@/lib/client/api";
import type { InvitationSummaryJson } from "@/lib/invitations/schemas";
import { createInvitationSchema } from "@/lib/validations/invitations";

const stateLabel: Record<InvitationSummaryJson["state"], string> = {
  pending: "Waiting for an answer",
  accepted: "Accepted",
  revoked: "Withdrawn",
  expired: "Expired",
};

const day = (iso: string) => new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

/** "Invite by e-mail" on a trial's team: invite, then resend or withdraw what is still open. */
export function InviteForm({ trialId, initial, readOnlyReason }: { trialId: string; initial: InvitationSummaryJson[]; readOnlyReason: string | null }) {
  const [invitations, setInvitations] = useState(initial);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  function replace(updated: InvitationSummaryJson) {
    setInvitations((current) => [updated, ...current.filter((invitation) => invitation.id !== updated.id)]);
  }

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    setMessage(null);
    const values = { trialId, email: String(new FormData(form).get("email") ?? ""), role: String(new FormData(form).get("role") ?? "") };
    const parsed = createInvitationSchema.safeParse(values);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((issue) => [String(issue.path[0]), issue.message])));
      return;
    }
    setErrors({});
    setBusy(true);
    const result = await callApi<InvitationSummaryJson>("/api/invitations", { method: "POST", json: parsed.data });
    setBusy(false);
    if (!result.ok) {
      setErrors(toFieldErrors(result.error));
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    replace(result.data);
    form.reset();
    setMessage({ kind: "ok", text: `Invitation sent to ${result.data.email}.` });
  }

  async function act(invitation: InvitationSummaryJson, what: "resend" | "revoke") {
    setMessage(null);
    const result =
      what === "resend"
        ? await callApi<InvitationSummaryJson>(`/api/invitations/${invitation.id}/resend`, { method: "POST" })
        : await callApi<InvitationSummaryJson>(`/api/invitations/${invitation.id}`, { method: "DELETE" });
    if (!result.ok) {
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    replace(result.data);
    setMessage({ kind: "ok", text: what === "resend" ? `A new link went to ${invitation.email}; the old one no longer works.` : `The invitation to ${invitation.email} is withdrawn.` });
  }

  return (
    <section aria-labelledby="invite-heading" className="mt-8 rounded border border-soil-200 bg-white p-5" data-testid="invite-by-email">
      <h2 id="invite-heading" className="text-lg font-semibold">Invite by e-mail</h2>
      <p className="mb-3 text-sm text-soil-700">
        Someone not in the list above? Send them a link to join as a technician or reviewer. It works once, for seven days; they can create an account
        or use the one they have.
      </p>
      {readOnlyReason ? (
        <p className="text-sm text-soil-700">{readOnlyReason}</p>
      ) : (
        <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-end gap-3">
          <Field label="E-mail" name="email" type="email" autoComplete="off" error={errors.email} className="min-w-64 flex-1" />
          <label className="block text-sm">
            <span className="mb-1 block font-medium text-soil-900">Role</span>
            <select name="role" defaultValue="technician" className="rounded border border-soil-200 px-3 py-2 text-base">
              <option value="technician">Technician</option>
              <option value="reviewer">Reviewer</option>
            </select>
            {errors.role && <span role="alert" className="mt-1 block text-sm text-red-700">{errors.role}</span>}
          </label>
          <Button type="submit" disabled={busy}>
            {busy ? "Sending…" : "Send invitation"}
          </Button>
        </form>
      )}
      {message && (
        <p role={message.kind === "error" ? "alert" : "status"} className={`mt-3 rounded px-3 py-2 text-sm ${message.kind === "error" ? "bg-red-50 text-red-800" : "bg-leaf-50 text-leaf-900"}`}>
          {message.text}
        </p>
      )}
      {invitations.length > 0 && (
        <ul className="mt-4 divide-y divide-soil-100 text-sm" aria-label="Invitations">
          {invitations.map((invitation) => (
            <li key={invitation.id} className="flex flex-wrap items-center gap-3 py-2" data-testid="invitation">
              <span className="font-medium">{invitation.email}</span>
              <span className="text-soil-700">{invitation.role}</span>
              <span className="text-soil-700">
                {stateLabel[invitation.state]}
                {invitation.state === "pending" ? ` · until ${day(invitation.expiresAt)}` : ""}
              </span>
              {!readOnlyReason && (invitation.state === "pending" || invitation.state === "expired") && (
                <span className="ml-auto flex gap-2">
                  <Button type="button" variant="secondary" className="px-2 py-1 text-xs" onClick={() => act(invitation, "resend")}>
                    Resend
                  </Button>
                  {invitation.state === "pending" && (
                    <Button type="button" variant="secondary" className="px-2 py-1 text-xs" onClick={() => act(invitation, "revoke")}>
                      Withdraw
                    </Button>
                  )}
                </span>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
