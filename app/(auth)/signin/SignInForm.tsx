"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { signInSchema } from "@/lib/validations/auth";

export function SignInForm({ callbackUrl }: { callbackUrl: string }) {
  const router = useRouter();
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setError(null);
    const form = new FormData(event.currentTarget);
    const parsed = signInSchema.safeParse({ email: form.get("email"), password: form.get("password") });
    if (!parsed.success) {
      setFieldErrors(Object.fromEntries(parsed.error.issues.map((issue) => [String(issue.path[0]), issue.message])));
      return;
    }
    setFieldErrors({});
    setBusy(true);
    const result = await signIn("credentials", { ...parsed.data, redirect: false });
    setBusy(false);
    if (!result || result.error) {
      setError(
        result?.error === "TooManyAttempts"
          ? "Too many failed attempts. Wait 15 minutes and try again, or reset your password."
          : "That e-mail and password do not match an account.",
      );
      return;
    }
    router.replace(callbackUrl);
    router.refresh();
  }

  return (
    <form method="post" onSubmit={onSubmit} noValidate className="space-y-4">
      <h1 className="text-lg font-semibold">Sign in</h1>
      {error && (
        <p role="alert" className="rounded bg-red-50 px-3 py-2 text-sm text-red-800">
          {error}
        </p>
      )}
      <Field label="E-mail" name="email" type="email" autoComplete="email" error={fieldErrors.email} />
      <Field label="Password" name="password" type="password" autoComplete="current-password" error={fieldErrors.password} />
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Signing in…" : "Sign in"}
      </Button>
      <p className="text-center text-sm">
        <Link href="/forgot-password" className="text-leaf-700 underline">Forgot password?</Link>
      </p>
      <p className="text-center text-sm text-soil-700">
        Grower without an account? <Link href="/register" className="text-leaf-700 underline">Create one</Link>
      </p>
    </form>
  );
}
