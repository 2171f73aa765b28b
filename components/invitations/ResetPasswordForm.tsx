"use client";

import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { callApi, fieldErrors as toFieldErrors } from "@/lib/client/api";
import { newPasswordSchema } from "@/lib/validations/password-reset";

export function ResetPasswordForm({ token, email }: { token: string; email: string }) {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setMessage(null);
    const values = Object.fromEntries(new FormData(event.currentTarget)) as Record<string, string>;
    const parsed = newPasswordSchema.safeParse(values);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((issue) => [String(issue.path[0]), issue.message])));
      return;
    }
    setErrors({});
    setBusy(true);
    const result = await callApi("/api/password-reset/confirm", { method: "POST", json: { token, ...parsed.data } });
    setBusy(false);
    if (!result.ok) {
      setErrors(toFieldErrors(result.error));
      setMessage(result.error.message);
      return;
    }
    setDone(true);
  }

  if (done) {
    return (
      <div className="space-y-4">
        <h1 className="text-lg font-semibold">Password changed</h1>
        <p role="status" className="rounded bg-leaf-50 px-3 py-2 text-sm text-leaf-900" data-testid="reset-done">
          Your new password is set. Sign in with it now.
        </p>
        <Link href="/signin" className="block rounded bg-leaf-600 px-4 py-2 text-center text-sm font-medium text-white hover:bg-leaf-700">
          Sign in
        </Link>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <h1 className="text-lg font-semibold">Choose a new password</h1>
      <p className="text-sm text-soil-700">For {email}.</p>
      {message && (
        <p role="alert" className="rounded bg-red-50 px-3 py-2 text-sm text-red-800">
          {message}
        </p>
      )}
      <Field label="New password (at least 10 characters)" name="password" type="password" autoComplete="new-password" error={errors.password} />
      <Field label="New password again" name="confirmPassword" type="password" autoComplete="new-password" error={errors.confirmPassword} />
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Saving…" : "Set the new password"}
      </Button>
    </form>
  );
}
