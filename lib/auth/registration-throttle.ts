import "server-only";
import { AppError } from "@/lib/errors";
import { hashedBucket, recordAttempt } from "@/lib/rate-limit";

/**
 * Sign-ups allowed per client address in an hour. Registration is open to anyone and its
 * answer says whether an address already has an account, so the limit bounds both account
 * spam and how many addresses one network can probe. A household or a field station
 * behind one address still has room for many real sign-ups.
 */
export const registrationLimits = { perClient: 20, windowMs: 60 * 60 * 1000 } as const;

export const tooManyRegistrations = "Too many sign-up attempts from this network. Wait an hour and try again.";

/** Counts every attempt that got past validation, refused ones included (as password resets do). */
export async function assertRegistrationAllowed(clientAddress: string): Promise<void> {
  const { allowed } = await recordAttempt([
    { bucket: hashedBucket("register-client", clientAddress), max: registrationLimits.perClient, windowMs: registrationLimits.windowMs },
  ]);
  if (!allowed) throw new AppError("RATE_LIMITED", tooManyRegistrations);
}
