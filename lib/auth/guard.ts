import "server-only";
import type { NextRequest } from "next/server";
import { z } from "zod";
import { AppError, unexpectedFailure, type ErrorCode, type FieldProblem } from "@/lib/errors";
import { databaseUnavailable, errorResponse, fromZodError, isDatabaseUnavailable } from "@/lib/http";
import { readBodyText } from "@/lib/security/request-body";
import type { Trial } from "@/models";
import type { Permission } from "./permissions";
import { currentUser, type SessionUser } from "./session";
import { authorize } from "./trial-access";

type Schema = z.ZodType;
type Parsed<S> = S extends z.ZodType ? z.output<S> : undefined;

interface RouteSpec<P extends Schema | undefined, Q extends Schema | undefined, B extends Schema | undefined> {
  permission: Permission;
  params?: P;
  query?: Q;
  body?: B;
  /** Names the trial a trial permission is checked against. */
  trialId?: (input: { params: Parsed<P>; query: Parsed<Q>; body: Parsed<B> }) => string | Promise<string>;
}

export interface RouteContext<P, Q, B> {
  request: NextRequest;
  user: SessionUser;
  params: P;
  query: Q;
  body: B;
  trial?: Trial;
}

async function readJson(request: NextRequest): Promise<unknown> {
  const text = await readBodyText(request);
  if (text.length === 0) return {};
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("INVALID_INPUT", "The request body is not valid JSON.");
  }
}

/** A route that takes no body says so rather than ignoring whatever was sent. */
async function refuseBody<B>(request: NextRequest): Promise<B> {
  const text = (await readBodyText(request)).trim();
  if (text !== "" && text !== "{}") throw new AppError("INVALID_INPUT", "This request takes no body.");
  return undefined as B;
}

function validate<S extends Schema | undefined>(schema: S, value: unknown, what: string): Parsed<S> {
  if (!schema) return undefined as Parsed<S>;
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw fromZodError(parsed.error, `The ${what} is not valid.`);
  return parsed.data as Parsed<S>;
}

/**
 * Every route handler goes through here: session (401) → validate (422) → authorize
 * (403/404) → act → respond, with every failure shaped by lib/http.
 */
export function route<P extends Schema | undefined = undefined, Q extends Schema | undefined = undefined, B extends Schema | undefined = undefined>(
  spec: RouteSpec<P, Q, B>,
  handle: (context: RouteContext<Parsed<P>, Parsed<Q>, Parsed<B>>) => Promise<Response>,
) {
  return async (request: NextRequest, segment: { params: Promise<Record<string, string | string[]>> }): Promise<Response> => {
    try {
      const user = await currentUser();
      if (!user) throw new AppError("UNAUTHENTICATED", "Please sign in to continue.");
      const params = validate<P>(spec.params as P, await segment?.params, "address");
      const query = validate<Q>(spec.query as Q, Object.fromEntries(request.nextUrl.searchParams), "query");
      const body = spec.body ? validate<B>(spec.body as B, await readJson(request), "request") : await refuseBody<Parsed<B>>(request);
      const trialId = await spec.trialId?.({ params, query, body });
      const trial = await authorize(user, spec.permission, trialId);
      return await handle({ request, user, params, query, body, trial });
    } catch (error) {
      return errorResponse(error);
    }
  };
}

export type ActionResult<T> =
  | { ok: true; data: T }
  | { ok: false; error: { code: ErrorCode; message: string; fields?: FieldProblem[] } };

/** The same order for server actions; the result is plain data a form can show. */
export function action<S extends Schema, T>(
  spec: { permission: Permission; input: S; trialId?: (input: z.output<S>) => string | Promise<string> },
  handle: (context: { user: SessionUser; input: z.output<S>; trial?: Trial }) => Promise<T>,
) {
  return async (raw: unknown): Promise<ActionResult<T>> => {
    try {
      const user = await currentUser();
      if (!user) throw new AppError("UNAUTHENTICATED", "Please sign in to continue.");
      const input = validate(spec.input, raw, "form") as z.output<S>;
      const trial = await authorize(user, spec.permission, await spec.trialId?.(input));
      return { ok: true, data: await handle({ user, input, trial }) };
    } catch (error) {
      let known = error instanceof AppError ? error : isDatabaseUnavailable(error) ? databaseUnavailable() : null;
      if (!known) {
        console.error("server action failed", error);
        known = unexpectedFailure();
      }
      return { ok: false, error: { code: known.code, message: known.message, ...(known.fields ? { fields: known.fields } : {}) } };
    }
  };
}

/**
 * For the few endpoints meant for everyone (health, self-registration, the public library):
 * the same validation and error shaping, and the reason it is public stated at the call.
 */
export function publicRoute<P extends Schema | undefined = undefined, Q extends Schema | undefined = undefined, B extends Schema | undefined = undefined>(
  spec: { why: string; params?: P; query?: Q; body?: B },
  handle: (context: { request: NextRequest; params: Parsed<P>; query: Parsed<Q>; body: Parsed<B> }) => Promise<Response>,
) {
  return async (request: NextRequest, segment: { params: Promise<Record<string, string | string[]>> }): Promise<Response> => {
    try {
      const params = validate<P>(spec.params as P, await segment?.params, "address");
      const query = validate<Q>(spec.query as Q, Object.fromEntries(request.nextUrl.searchParams), "query");
      const body = spec.body ? validate<B>(spec.body as B, await readJson(request), "request") : await refuseBody<Parsed<B>>(request);
      return await handle({ request, params, query, body });
    } catch (error) {
      return errorResponse(error);
    }
  };
}
