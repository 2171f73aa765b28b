"use client";

import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { callApi } from "@/lib/client/api";
import { requestPasswordResetSchema } from "@/lib/validations/password-reset";

export function ForgotPasswordForm() {
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setError(null);
    const parsed = requestPasswordResetSchema.safeParse({ email: new FormData(event.currentTarget).get("email") });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? "Enter a valid e-mail address.");
      return;
    }
    setBusy(true);
    const result = await callApi<{ message: string }>("/api/password-reset", { method: "POST", json: parsed.data });
    setBusy(false);
    if (!result.ok) {
      setError(result.error.message);
      return;
    }
    setDone(result.data.message);
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <h1 className="text-lg font-semibold">Forgot your password?</h1>
      {done ? (
        <p role="status" className="rounded bg-leaf-50 px-3 py-2 text-sm text-leaf-900" data-testid="reset-requested">
          {done}
        </p>
      ) : (
        <>
          <p className="text-sm text-soil-700">Enter the e-mail address of your account and we will send you a link to choose a new password.</p>
          {error && (
            <p role="alert" className="rounded bg-red-50 px-3 py-2 text-sm text-red-800">
              {error}
            </p>
          )}
          <Field label="E-mail" name="email" type="email" autoComplete="email" />
          <Button type="submit" disabled={busy} className="w-full">
            {busy ? "Sending…" : "Send me a link"}
          </Button>
        </>
      )}
      <p className="text-center text-sm text-soil-700">
        <Link href="/signin" className="text-leaf-700 underline">Back to sign-in</Link>
      </p>
    </form>
  );
}
