"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { callApi, fieldErrors as toFieldErrors } from "@/lib/client/api";
import { registerSchema } from "@/lib/validations/auth";

export function RegisterForm() {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setMessage(null);
    const values = Object.fromEntries(new FormData(event.currentTarget)) as Record<string, string>;
    const parsed = registerSchema.safeParse(values);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((issue) => [String(issue.path[0]), issue.message])));
      return;
    }
    setErrors({});
    setBusy(true);
    const result = await callApi("/api/register", { method: "POST", json: values });
    if (!result.ok) {
      setBusy(false);
      setErrors(toFieldErrors(result.error));
      setMessage(result.error.message);
      return;
    }
    await signIn("credentials", { email: parsed.data.email, password: parsed.data.password, redirect: false });
    router.replace("/");
    router.refresh();
  }

  return (
    <form method="post" onSubmit={onSubmit} noValidate className="space-y-4">
      <h1 className="text-lg font-semibold">Create a grower account</h1>
      <p className="text-sm text-soil-700">
        Growers read published trial results and can follow crops and methods. Researchers, technicians and reviewers are
        added by an administrator or invited to a trial.
      </p>
      {message && (
        <p role="alert" className="rounded bg-red-50 px-3 py-2 text-sm text-red-800">
          {message}
        </p>
      )}
      <Field label="Name" name="name" autoComplete="name" error={errors.name} />
      <Field label="E-mail" name="email" type="email" autoComplete="email" error={errors.email} />
      <Field label="Password (at least 10 characters)" name="password" type="password" autoComplete="new-password" error={errors.password} />
      <Field label="Password again" name="confirmPassword" type="password" autoComplete="new-password" error={errors.confirmPassword} />
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Creating…" : "Create account"}
      </Button>
      <p className="text-center text-sm text-soil-700">
        Have an account? <Link href="/signin" className="text-leaf-700 underline">Sign in</Link>
      </p>
    </form>
  );
}
