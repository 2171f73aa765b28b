import { NextResponse } from "next/server";
import { z } from "zod";
import { AppError, isAppError } from "./errors";

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

/** Turns any thrown value into a JSON response; unknown errors never leak their details. */
export function errorResponse(error: unknown): NextResponse<ErrorBody> {
  const appError = isAppError(error)
    ? error
    : error instanceof z.ZodError
      ? fromZodError(error)
      : null;
  if (!appError) {
    console.error("unexpected error", error);
    return NextResponse.json(
      { error: { code: "INTERNAL", message: "Something went wrong on our side. Nothing was changed; please try again." } },
      { status: 500 },
    );
  }
  return NextResponse.json(
    { error: { code: appError.code, message: appError.message, ...(appError.fields ? { fields: appError.fields } : {}) } },
    { status: appError.status },
  );
}

/** Responses are always shaped by a schema: unknown keys (and model internals) are stripped. */
export function jsonResponse<Schema extends z.ZodType>(schema: Schema, body: z.input<Schema>, status = 200): NextResponse {
  return NextResponse.json(schema.parse(body), { status });
}
