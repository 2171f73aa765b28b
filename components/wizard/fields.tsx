import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";

/*
 * Labelled form controls for the wizard, each with its validation message right beneath it.
 * They take react-hook-form's register() output as props (React 19 passes ref as a prop).
 * Labels point at their control by id rather than wrapping it, so a select's name is its
 * label alone and not the label plus the chosen option.
 */

const control =
  "w-full rounded border border-soil-200 bg-white px-3 py-2 text-base focus:border-leaf-600 focus:outline-none focus:ring-2 focus:ring-leaf-100 aria-[invalid=true]:border-red-600 disabled:bg-soil-100 read-only:bg-soil-100";

function Message({ id, error }: { id: string; error?: string }) {
  if (!error) return null;
  return (
    <span id={id} role="alert" className="mt-1 block text-sm text-red-700">
      {error}
    </span>
  );
}

function useIds() {
  const base = useId();
  return { control: `${base}control`, error: `${base}error`, hint: `${base}hint` };
}

function describedBy(ids: ReturnType<typeof useIds>, error?: string, hint?: ReactNode) {
  return [error ? ids.error : null, hint ? ids.hint : null].filter(Boolean).join(" ") || undefined;
}

interface Common {
  label: string;
  name: string;
  error?: string;
  hint?: ReactNode;
  className?: string;
}

export function TextField({ label, name, error, hint, className = "", ...input }: Common & InputHTMLAttributes<HTMLInputElement>) {
  const ids = useIds();
  return (
    <div className={`text-sm ${className}`}>
      <label htmlFor={ids.control} className="mb-1 block font-medium text-soil-900">
        {label}
      </label>
      <input id={ids.control} name={name} aria-invalid={error ? true : undefined} aria-describedby={describedBy(ids, error, hint)} className={control} {...input} />
      {hint && <span id={ids.hint} className="mt-1 block text-xs text-soil-700">{hint}</span>}
      <Message id={ids.error} error={error} />
    </div>
  );
}

export function TextAreaField({ label, name, error, hint, className = "", ...input }: Common & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  const ids = useIds();
  return (
    <div className={`text-sm ${className}`}>
      <label htmlFor={ids.control} className="mb-1 block font-medium text-soil-900">
        {label}
      </label>
      <textarea id={ids.control} name={name} rows={3} aria-invalid={error ? true : undefined} aria-describedby={describedBy(ids, error, hint)} className={control} {...input} />
      {hint && <span id={ids.hint} className="mt-1 block text-xs text-soil-700">{hint}</span>}
      <Message id={ids.error} error={error} />
    </div>
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
  const ids = useIds();
  return (
    <div className={`text-sm ${className}`}>
      <label htmlFor={ids.control} className="mb-1 block font-medium text-soil-900">
        {label}
      </label>
      <select id={ids.control} name={name} aria-invalid={error ? true : undefined} aria-describedby={describedBy(ids, error, hint)} className={control} {...select}>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
      {hint && <span id={ids.hint} className="mt-1 block text-xs text-soil-700">{hint}</span>}
      <Message id={ids.error} error={error} />
    </div>
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
