import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import type { ApiFailure } from "@/lib/client/api";

/** Puts the server's field problems next to the fields, as the browser's own check would. */
export function showServerErrors<T extends FieldValues>(error: ApiFailure, setError: UseFormSetError<T>): void {
  for (const field of error.fields ?? []) setError(field.path as Path<T>, { type: "server", message: field.message });
}

/** A nested error message by dotted path ("treatments.2.code"). */
export function errorAt(errors: unknown, path: string): string | undefined {
  let node: unknown = errors;
  for (const key of path.split(".")) {
    if (node === null || typeof node !== "object") return undefined;
    node = (node as Record<string, unknown>)[key];
  }
  const message = (node as { message?: unknown } | undefined)?.message;
  return typeof message === "string" ? message : undefined;
}
