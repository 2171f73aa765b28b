"use client";

import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";
import type { NotificationType } from "@/lib/notifications/events";
import { notificationTypes } from "@/lib/notifications/types";
import { notificationSettingsSchema } from "@/lib/validations/notification-settings";

interface Preferences {
  delivery: "immediate" | "digest";
  muted: NotificationType[];
}

export function NotificationSettingsForm({ initial }: { initial: Preferences }) {
  const [delivery, setDelivery] = useState(initial.delivery);
  const [muted, setMuted] = useState(new Set(initial.muted));
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  function toggle(type: NotificationType, wanted: boolean) {
    const next = new Set(muted);
    if (wanted) next.delete(type);
    else next.add(type);
    setMuted(next);
  }

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const parsed = notificationSettingsSchema.safeParse({ delivery, muted: [...muted] });
    if (!parsed.success) {
      setMessage({ kind: "error", text: parsed.error.issues[0]?.message ?? "Check your choices." });
      return;
    }
    setBusy(true);
    const result = await callApi("/api/notification-settings", { method: "PUT", json: parsed.data });
    setBusy(false);
    setMessage(result.ok ? { kind: "ok", text: "Saved." } : { kind: "error", text: result.error.message });
  }

  return (
    <form onSubmit={onSubmit} className="max-w-xl space-y-6 rounded border border-soil-200 bg-white p-5">
      <fieldset className="space-y-2">
        <legend className="mb-2 font-medium">E-mail me about</legend>
        {notificationTypes.map(({ type, label }) => (
          <label key={type} className="flex items-center gap-2 text-sm">
            <input type="checkbox" name={type} checked={!muted.has(type)} onChange={(event) => toggle(type, event.target.checked)} className="h-4 w-4 accent-leaf-600" />
            {label}
          </label>
        ))}
      </fieldset>
      <fieldset className="space-y-2">
        <legend className="mb-2 font-medium">How</legend>
        <label className="flex items-center gap-2 text-sm">
          <input type="radio" name="delivery" value="immediate" checked={delivery === "immediate"} onChange={() => setDelivery("immediate")} className="accent-leaf-600" />
          One e-mail for each notice, as it happens
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="radio" name="delivery" value="digest" checked={delivery === "digest"} onChange={() => setDelivery("digest")} className="accent-leaf-600" />
          One daily digest with everything from the day before
        </label>
      </fieldset>
      {message && (
        <p role={message.kind === "error" ? "alert" : "status"} className={`rounded px-3 py-2 text-sm ${message.kind === "error" ? "bg-red-50 text-red-800" : "bg-leaf-50 text-leaf-900"}`}>
          {message.text}
        </p>
      )}
      <Button type="submit" disabled={busy}>
        {busy ? "Saving…" : "Save settings"}
      </Button>
    </form>
  );
}
