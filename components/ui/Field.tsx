import type { InputHTMLAttributes } from "react";

interface FieldProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  name: string;
  error?: string;
}

/** A labelled input with its validation message right beneath it. */
export function Field({ label, name, error, className = "", ...input }: FieldProps) {
  const errorId = `${name}-error`;
  return (
    <label className={`block text-sm ${className}`}>
      <span className="mb-1 block font-medium text-soil-900">{label}</span>
      <input
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        className="w-full rounded border border-soil-200 px-3 py-2 text-base focus:border-leaf-600 focus:outline-none focus:ring-2 focus:ring-leaf-100 aria-[invalid=true]:border-red-600"
        {...input}
      />
      {error && (
        <span id={errorId} role="alert" className="mt-1 block text-sm text-red-700">
          {error}
        </span>
      )}
    </label>
  );
}
