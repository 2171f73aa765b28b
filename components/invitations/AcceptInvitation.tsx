"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { signIn, signOut } from "next-auth/react";
import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { callApi, fieldErrors as toFieldErrors } from "@/lib/client/api";
import { newAccountFromInvitationSchema } from "@/lib/validations/invitations";

export type AcceptMode =
  | { kind: "join" }
  | { kind: "create" }
  | { kind: "sign-in" }
  | { kind: "other-account"; signedInAs: string };

interface Props {
  token: string;
  email: string;
  trialTitle: string;
  role: string;
  inviterName: string;
  mode: AcceptMode;
}

export function AcceptInvitation({ token, email, trialTitle, role, inviterName, mode }: Props) {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const callbackUrl = `/invite/${token}`;

  async function accept(values: { name?: string; password?: string; confirmPassword?: string } = {}) {
    setBusy(true);
    setMessage(null);
    const result = await callApi<{ trialId: string; email: string; createdAccount: boolean }>("/api/invitations/accept", { method: "POST", json: { token, ...values } });
    if (!result.ok) {
      setBusy(false);
      setErrors(toFieldErrors(result.error));
      setMessage(result.error.message);
      return;
    }
    if (result.data.createdAccount && values.password) {
      await signIn("credentials", { email, password: values.password, redirect: false });
    }
    router.replace(`/trials/${result.data.trialId}`);
    router.refresh();
  }

  async function onCreate(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const values = Object.fromEntries(new FormData(event.currentTarget)) as Record<string, string>;
    const parsed = newAccountFromInvitationSchema.safeParse(values);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((issue) => [String(issue.path[0]), issue.message])));
      return;
    }
    setErrors({});
    await accept(parsed.data);
  }

  return (
    <div className="space-y-4">
      <h1 className="text-lg font-semibold">Join “{trialTitle}”</h1>
      <p className="text-sm text-soil-700">
        {inviterName} invites <strong>{email}</strong> to this trial as a {role}.
      </p>
      {message && (
        <p role="alert" className="rounded bg-red-50 px-3 py-2 text-sm text-red-800">
          {message}
        </p>
      )}
      {mode.kind === "join" && (
        <Button type="button" className="w-full" disabled={busy} onClick={() => accept()}>
          {busy ? "Joining…" : "Join the trial"}
        </Button>
      )}
      {mode.kind === "sign-in" && (
        <>
          <p className="text-sm">You already have an account with this address. Sign in with it, and you will come back here to join.</p>
          <Link href={`/signin?callbackUrl=${encodeURIComponent(callbackUrl)}`} className="block rounded bg-leaf-600 px-4 py-2 text-center text-sm font-medium text-white hover:bg-leaf-700">
            Sign in to accept
          </Link>
          <p className="text-center text-sm">
            <Link href="/forgot-password" className="text-leaf-700 underline">Forgot your password?</Link>
          </p>
        </>
      )}
      {mode.kind === "other-account" && (
        <>
          <p role="alert" className="rounded bg-red-50 px-3 py-2 text-sm text-red-800">
            You are signed in as {mode.signedInAs}, but this invitation is for {email}. Sign out, then open the link again.
          </p>
          <Button type="button" variant="secondary" className="w-full" onClick={() => signOut({ callbackUrl })}>
            Sign out
          </Button>
        </>
      )}
      {mode.kind === "create" && (
        <form onSubmit={onCreate} noValidate className="space-y-4">
          <p className="text-sm">Create your account to join. Your e-mail address is the one the invitation was sent to.</p>
          <Field label="E-mail" name="email-shown" value={email} readOnly disabled />
          <Field label="Name" name="name" autoComplete="name" error={errors.name} />
          <Field label="Password (at least 10 characters)" name="password" type="password" autoComplete="new-password" error={errors.password} />
          <Field label="Password again" name="confirmPassword" type="password" autoComplete="new-password" error={errors.confirmPassword} />
          <Button type="submit" disabled={busy} className="w-full">
            {busy ? "Creating…" : "Create account and join"}
          </Button>
        </form>
      )}
    </div>
  );
}
