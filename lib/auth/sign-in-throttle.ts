import "server-only";
import { hashedBucket, overLimit, recordHits, type Limit } from "@/lib/rate-limit";

/** Failed sign-ins allowed in 15 minutes: per account, and per client address. */
export const signInLimits = { perAccount: 10, perClient: 50, windowMs: 15 * 60 * 1000 } as const;

export class TooManySignInAttempts extends Error {
  constructor() {
    // next-auth hands this message to the sign-in form as its error code.
    super("TooManyAttempts");
  }
}

function limitsFor(email: string, clientAddress: string): Limit[] {
  return [
    { bucket: hashedBucket("sign-in-account", email), max: signInLimits.perAccount, windowMs: signInLimits.windowMs },
    { bucket: hashedBucket("sign-in-client", clientAddress), max: signInLimits.perClient, windowMs: signInLimits.windowMs },
  ];
}

/** The address a proxy in front of the app reports, else one shared bucket for direct clients. */
export function clientAddressOf(headers: Record<string, string | string[] | undefined> | undefined): string {
  const forwarded = headers?.["x-forwarded-for"];
  const first = (Array.isArray(forwarded) ? forwarded[0] : forwarded)?.split(",")[0]?.trim();
  return first || "direct";
}

export async function assertSignInAllowed(email: string, clientAddress: string): Promise<void> {
  if (await overLimit(limitsFor(email, clientAddress))) throw new TooManySignInAttempts();
}

export async function recordFailedSignIn(email: string, clientAddress: string): Promise<void> {
  await recordHits(limitsFor(email, clientAddress));
}
