import "server-only";
import { QueryTypes } from "sequelize";
import { hashPassword } from "@/lib/auth/password";
import { db } from "@/lib/db/sequelize";
import { AppError } from "@/lib/errors";
import { wakeMailWorker } from "@/lib/jobs/mail-worker";
import { queueMail } from "@/lib/mail/queue";
import { hashLinkToken, newLinkToken } from "@/lib/mail/tokens";
import { PasswordResetToken, User } from "@/models";
import { passwordResetMail } from "./mail";
import { hashedBucket, recordAttempt } from "@/lib/rate-limit";

export const RESET_LIFETIME_MS = 60 * 60 * 1000;
export const resetLimits = { perAddress: 3, perClient: 20, windowMs: 60 * 60 * 1000 } as const;
/** Every request takes at least this long, whether or not the address has an account. */
const MIN_RESPONSE_MS = 350;

export const resetRequestAnswer =
  "If an account exists for that address, we have sent it a link to choose a new password. The link works once, for one hour.";

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Answers the same way for every address: the work that differs (writing the token, queueing
 * the mail) is small and the answer is held to a common minimum time.
 */
export async function requestPasswordReset(email: string, clientAddress: string): Promise<void> {
  const started = Date.now();
  try {
    const { allowed } = await recordAttempt([
      { bucket: hashedBucket("reset-address", email), max: resetLimits.perAddress, windowMs: resetLimits.windowMs },
      { bucket: hashedBucket("reset-client", clientAddress), max: resetLimits.perClient, windowMs: resetLimits.windowMs },
    ]);
    if (!allowed) {
      throw new AppError("RATE_LIMITED", "Too many reset requests for this address or from this network. Wait an hour and try again.");
    }
    db();
    const user = await User.findOne({ where: { email } });
    const { token, hash } = newLinkToken();
    if (user && user.active) {
      const expiresAt = new Date(Date.now() + RESET_LIFETIME_MS);
      await PasswordResetToken.create({ userId: user.id, tokenHash: hash, expiresAt });
      await queueMail({ kind: "password-reset", to: user.email, ...passwordResetMail({ token, name: user.name }) });
      wakeMailWorker();
    }
  } finally {
    const elapsed = Date.now() - started;
    if (elapsed < MIN_RESPONSE_MS) await sleep(MIN_RESPONSE_MS - elapsed + Math.random() * 50);
  }
}

export type ResetLinkState = "valid" | "used" | "expired" | "unknown";

export async function resetLinkState(token: string): Promise<{ state: ResetLinkState; email?: string }> {
  db();
  const row = await PasswordResetToken.findOne({ where: { tokenHash: hashLinkToken(token) } });
  if (!row) return { state: "unknown" };
  if (row.usedAt) return { state: "used" };
  if (row.expiresAt.getTime() <= Date.now()) return { state: "expired" };
  const user = await User.findByPk(row.userId, { attributes: ["email", "active"] });
  if (!user || !user.active) return { state: "unknown" };
  return { state: "valid", email: user.email };
}

export const resetRefusals: Record<Exclude<ResetLinkState, "valid">, string> = {
  used: "This reset link has already been used. If you still need a new password, ask for another link.",
  expired: "This reset link has expired (links work for one hour). Ask for a new one.",
  unknown: "This reset link is not valid. Check that you opened the whole link from the e-mail, or ask for a new one.",
};

/**
 * Uses the token once (a conditional update in the same transaction as the new password) and
 * retires every other unused link of that person.
 */
export async function resetPassword(token: string, password: string): Promise<{ email: string }> {
  const sequelize = db();
  const hash = hashLinkToken(token);
  const passwordHash = await hashPassword(password);
  const email = await sequelize.transaction(async (transaction) => {
    const [claimed] = await sequelize.query<{ user_id: string }>(
      `UPDATE password_reset_tokens SET used_at = now(), updated_at = now()
       WHERE token_hash = :hash AND used_at IS NULL AND expires_at > now() RETURNING user_id`,
      { type: QueryTypes.SELECT, replacements: { hash }, transaction },
    );
    const user = claimed ? await User.findByPk(claimed.user_id, { transaction }) : null;
    if (!claimed || !user || !user.active) return null;
    await user.update({ passwordHash }, { transaction });
    await sequelize.query(`UPDATE password_reset_tokens SET used_at = now(), updated_at = now() WHERE user_id = :userId AND used_at IS NULL`, {
      replacements: { userId: user.id },
      transaction,
    });
    return user.email;
  });
  if (!email) {
    const { state } = await resetLinkState(token);
    throw new AppError(state === "unknown" || state === "valid" ? "NOT_FOUND" : "CONFLICT", resetRefusals[state === "valid" ? "unknown" : state]);
  }
  return { email };
}
