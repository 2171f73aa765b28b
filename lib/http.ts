import { NextResponse } from "next/server";
import { z } from "zod";
import { AppError, isAppError, unexpectedFailure } from "./errors";

export interface ErrorBody {
  error: { code: string; message: string; fields?: { path: string; message: string }[] };
}

export function fromZodError(error: z.ZodError, message = "Some fields need attention."): AppError {
  return new AppError(
    "INVALID_INPUT",
    message,
    error.issues.map((issue) => ({ path: issue.path.join("."), message: issue.message })),
  );
}

const connectionErrorNames = new Set([
  "SequelizeConnectionError",
  "SequelizeConnectionRefusedError",
  "SequelizeConnectionAcquireTimeoutError",
  "SequelizeConnectionTimedOutError",
  "SequelizeHostNotFoundError",
  "SequelizeHostNotReachableError",
  "SequelizeAccessDeniedError",
]);
// PostgreSQL's codes for a server that is shutting down, refusing, or gone (class 08 and 57P).
const connectionSqlStates = /^(08|57P0[1-3])/;

/** A database that is down is a passing fault the user can wait out, not a bug. */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (!(error instanceof Error)) return false;
  if (connectionErrorNames.has(error.name)) return true;
  const parent = (error as { parent?: { code?: string; message?: string } }).parent ?? (error as { original?: { code?: string; message?: string } }).original;
  const code = parent?.code ?? (error as { code?: string }).code;
  if (typeof code === "string" && (connectionSqlStates.test(code) || code === "ECONNREFUSED" || code === "ECONNRESET")) return true;
  return /Connection terminated|terminating connection|ECONNREFUSED|does not allow connections/i.test(parent?.message ?? error.message);
}

export const databaseUnavailable = () =>
  new AppError("UNAVAILABLE", "The database is not answering. Nothing was saved; try again in a minute.");

/** Turns any thrown value into a JSON response; unknown errors never leak their details. */
export function errorResponse(error: unknown): NextResponse<ErrorBody> {
  const appError = isAppError(error)
    ? error
    : error instanceof z.ZodError
      ? fromZodError(error)
      : isDatabaseUnavailable(error)
        ? databaseUnavailable()
        : null;
  if (!appError) console.error("unexpected error", error);
  const known = appError ?? unexpectedFailure();
  return NextResponse.json(
    { error: { code: known.code, message: known.message, ...(known.fields ? { fields: known.fields } : {}) } },
    { status: known.status },
  );
}

/** Responses are always shaped by a schema: unknown keys (and model internals) are stripped. */
export function jsonResponse<Schema extends z.ZodType>(schema: Schema, body: z.input<Schema>, status = 200): NextResponse {
  return NextResponse.json(schema.parse(body), { status });
}
