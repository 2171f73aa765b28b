/**
 * The one application error. Its closed set of codes maps to HTTP statuses here and
 * nowhere else, so route handlers, server actions and pages agree on what a failure means.
 */
export const errorStatus = {
  UNAUTHENTICATED: 401,
  FORBIDDEN: 403,
  NOT_FOUND: 404,
  CONFLICT: 409,
  PAYLOAD_TOO_LARGE: 413,
  INVALID_INPUT: 422,
  RATE_LIMITED: 429,
  UNAVAILABLE: 503,
  /** A fault of ours; its details go to the log, never to the client. */
  INTERNAL: 500,
} as const;

export type ErrorCode = keyof typeof errorStatus;

export interface FieldProblem {
  path: string;
  message: string;
}

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields?: FieldProblem[];

  constructor(code: ErrorCode, message: string, fields?: FieldProblem[]) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.fields = fields;
  }

  get status(): number {
    return errorStatus[this.code];
  }
}

export function isAppError(error: unknown): error is AppError {
  return error instanceof AppError;
}

export const notSignedIn = () => new AppError("UNAUTHENTICATED", "Please sign in to continue.");
export const notAllowed = (what = "do this") => new AppError("FORBIDDEN", `Your role does not allow you to ${what}.`);
export const unexpectedFailure = () => new AppError("INTERNAL", "Something went wrong on our side. Nothing was changed; please try again.");
export const notFound = (what = "page") => new AppError("NOT_FOUND", `That ${what} does not exist or is not visible to you.`);
