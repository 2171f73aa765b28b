"use client";

import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { roleLabels, roles } from "@/lib/auth/roles";
import { createUserSchema } from "@/lib/validations/auth";
import { createUserAction } from "./actions";

export function CreateUserForm() {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formElement = event.currentTarget;
    const values = Object.fromEntries(new FormData(formElement));
    const parsed = createUserSchema.safeParse(values);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((issue) => [String(issue.path[0]), issue.message])));
      return;
    }
    setErrors({});
    setBusy(true);
    const result = await createUserAction(values);
    setBusy(false);
    if (!result.ok) {
      setErrors(Object.fromEntries((result.error.fields ?? []).map((field) => [field.path, field.message])));
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    formElement.reset();
    setMessage({ kind: "ok", text: `Created ${result.data.email} as ${roleLabels[result.data.role]}.` });
  }

  return (
    <form onSubmit={onSubmit} noValidate className="h-fit space-y-3 rounded border border-soil-200 bg-white p-4">
      <h2 className="font-semibold">Add a user</h2>
      {message && (
        <p role={message.kind === "error" ? "alert" : "status"} className={`rounded px-3 py-2 text-sm ${message.kind === "error" ? "bg-red-50 text-red-800" : "bg-leaf-50 text-leaf-900"}`}>
          {message.text}
        </p>
      )}
      <Field label="Name" name="name" error={errors.name} />
      <Field label="E-mail" name="email" type="email" error={errors.email} />
      <label className="block text-sm">
        <span className="mb-1 block font-medium">Role</span>
        <select name="role" defaultValue="technician" className="w-full rounded border border-soil-200 px-3 py-2">
          {roles.map((role) => (
            <option key={role} value={role}>
              {roleLabels[role]}
            </option>
          ))}
        </select>
        {errors.role && <span role="alert" className="mt-1 block text-red-700">{errors.role}</span>}
      </label>
      <Field label="First password (at least 10 characters)" name="password" type="password" autoComplete="new-password" error={errors.password} />
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Adding…" : "Add user"}
      </Button>
    </form>
  );
}
