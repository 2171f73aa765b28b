/**
 * How long a session lasts from sign-in. Absolute: reading or refreshing the session does not
 * extend it (next-auth re-issues its cookie on every session read; see ./options).
 */
export const SESSION_MAX_AGE_SECONDS = 8 * 60 * 60;

/** Seconds left of a session that began at `signedInAt` (seconds since the epoch); 0 when it is over. */
export function sessionSecondsLeft(signedInAt: unknown, nowMs = Date.now()): number {
  if (typeof signedInAt !== "number" || !Number.isFinite(signedInAt)) return 0;
  return Math.max(0, Math.floor(signedInAt + SESSION_MAX_AGE_SECONDS - nowMs / 1000));
}
