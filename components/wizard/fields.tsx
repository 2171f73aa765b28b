import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes, TextareaHTMLAttributes } from "react";

/*
 * Labelled form controls for the wizard, each with its validation message right beneath it.
 * They take react-hook-form's register() output as props (React 19 passes ref as a prop).
 */

const control =
  "w-full rounded border border-soil-200 bg-white px-3 py-2 text-base focus:border-leaf-600 focus:outline-none focus:ring-2 focus:ring-leaf-100 aria-[invalid=true]:border-red-600 disabled:bg-soil-100";

function errorId(name: string) {
  return `${name.replace(/\./g, "-")}-error`;
}

function Message({ name, error }: { name: string; error?: string }) {
  if (!error) return null;
  return (
    <span id={errorId(name)} role="alert" className="mt-1 block text-sm text-red-700">
      {error}
    </span>
  );
}

interface Common {
  label: string;
  name: string;
  error?: string;
  hint?: ReactNode;
  className?: string;
}

export function TextField({ label, name, error, hint, className = "", ...input }: Common & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <label className={`block text-sm ${className}`}>
      <span className="mb-1 block font-medium text-soil-900">{label}</span>
      <input name={name} aria-invalid={error ? true : undefined} aria-describedby={error ? errorId(name) : undefined} className={control} {...input} />
      {hint && <span className="mt-1 block text-xs text-soil-700">{hint}</span>}
      <Message name={name} error={error} />
    </label>
  );
}

export function TextAreaField({ label, name, error, hint, className = "", ...input }: Common & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  return (
    <label className={`block text-sm ${className}`}>
      <span className="mb-1 block font-medium text-soil-900">{label}</span>
      <textarea name={name} rows={3} aria-invalid={error ? true : undefined} aria-describedby={error ? errorId(name) : undefined} className={control} {...input} />
      {hint && <span className="mt-1 block text-xs text-soil-700">{hint}</span>}
      <Message name={name} error={error} />
    </label>
  );
}

export function SelectField({
  label,
  name,
  error,
  hint,
  className = "",
  options,
  ...select
}: Common & SelectHTMLAttributes<HTMLSelectElement> & { options: { value: string; label: string }[] }) {
  return (
    <label className={`block text-sm ${className}`}>
      <span className="mb-1 block font-medium text-soil-900">{label}</span>
      <select name={name} aria-invalid={error ? true : undefined} aria-describedby={error ? errorId(name) : undefined} className={control} {...select}>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
      {hint && <span className="mt-1 block text-xs text-soil-700">{hint}</span>}
      <Message name={name} error={error} />
    </label>
  );
}

export function FormMessage({ message }: { message: { kind: "ok" | "error"; text: string } | null }) {
  if (!message) return null;
  return (
    <p role={message.kind === "error" ? "alert" : "status"} className={`rounded px-3 py-2 text-sm ${message.kind === "error" ? "bg-red-50 text-red-800" : "bg-leaf-50 text-leaf-900"}`}>
      {message.text}
    </p>
  );
}
