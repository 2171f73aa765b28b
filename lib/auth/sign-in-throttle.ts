import "server-only";
import { clientAddressFrom } from "./client-address";
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

export function clientAddressOf(headers: Record<string, string | string[] | undefined> | undefined): string {
  return clientAddressFrom(headers?.["x-forwarded-for"]);
}

export async function assertSignInAllowed(email: string, clientAddress: string): Promise<void> {
  if (await overLimit(limitsFor(email, clientAddress))) throw new TooManySignInAttempts();
}

export async function recordFailedSignIn(email: string, clientAddress: string): Promise<void> {
  await recordHits(limitsFor(email, clientAddress));
}
