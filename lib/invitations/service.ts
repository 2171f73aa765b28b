import "server-only";
import { Op, QueryTypes, UniqueConstraintError, type Transaction } from "sequelize";
import { hashPassword } from "@/lib/auth/password";
import type { Role } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session";
import { db } from "@/lib/db/sequelize";
import { AppError } from "@/lib/errors";
import { wakeMailWorker } from "@/lib/jobs/mail-worker";
import { queueMail } from "@/lib/mail/queue";
import { hashLinkToken, newLinkToken } from "@/lib/mail/tokens";
import { editRefusal } from "@/lib/trials/edit-rules";
import type { MembershipRole } from "@/lib/trials/vocabulary";
import { Invitation, Membership, Trial, User } from "@/models";
import { invitationMail } from "./mail";

export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;

export type InvitationState = "pending" | "accepted" | "revoked" | "expired";

export function invitationState(invitation: Pick<Invitation, "acceptedAt" | "revokedAt" | "expiresAt">, now = new Date()): InvitationState {
  if (invitation.acceptedAt) return "accepted";
  if (invitation.revokedAt) return "revoked";
  if (invitation.expiresAt.getTime() <= now.getTime()) return "expired";
  return "pending";
}

/** What a refused link says: always why, and what to do next. */
export function refusalFor(state: Exclude<InvitationState, "pending">, inviterName: string): AppError {
  switch (state) {
    case "accepted":
      return new AppError("CONFLICT", "This invitation has already been used. Sign in to reach the trial.");
    case "revoked":
      return new AppError("CONFLICT", `This invitation was withdrawn. Ask ${inviterName} if you should still join.`);
    case "expired":
      return new AppError("CONFLICT", `This invitation has expired. Ask ${inviterName} to send it again.`);
  }
}

export const unknownLink = () => new AppError("NOT_FOUND", "This invitation link is not valid. Check that you opened the whole link from the e-mail, or ask for a new one.");

/** Queued in the transaction that stores the token, so a stored link always has its mail on the way. */
async function queueInvitationMail(invitation: Invitation, token: string, trial: Trial, inviterName: string, transaction: Transaction): Promise<void> {
  await queueMail(
    { kind: "invitation", to: invitation.email, ...invitationMail({ token, trialTitle: trial.title, crop: trial.crop, role: invitation.role, inviterName, expiresAt: invitation.expiresAt }) },
    { transaction },
  );
}

const invitableRoles: readonly Role[] = ["technician", "reviewer"];

/**
 * Roles belong to accounts and trial access needs the account's role (trial-access.ts), so an
 * existing account can only join as its own role. Said to the inviter when inviting...
 */
function roleRefusalForInviter(email: string, accountRole: Role, invitedRole: MembershipRole): AppError {
  const instead = invitableRoles.includes(accountRole) ? `Invite them as a ${accountRole} instead, or use another address.` : "Use another address to invite them.";
  const message = `${email} already has a ${accountRole} account, and an account keeps one role, so it cannot join this trial as a ${invitedRole}. ${instead}`;
  return new AppError("CONFLICT", message, [{ path: "role", message }]);
}

/** ...and to the invited person, should the account have appeared (or changed) since. */
export function roleRefusalForInvitee(view: Pick<InvitationView, "invitation" | "accountRole" | "inviterName">): AppError | null {
  const { invitation, accountRole, inviterName } = view;
  if (!accountRole || accountRole === invitation.role) return null;
  const instead = invitableRoles.includes(accountRole) ? ` as a ${accountRole}, or at another address` : " at another address";
  return new AppError(
    "CONFLICT",
    `This invitation is for a ${invitation.role}, but ${invitation.email} already has a ${accountRole} account, and an account keeps one role. Ask ${inviterName} to invite you${instead}.`,
  );
}

function assertTeamOpen(trial: Trial): void {
  const refusal = editRefusal("team", { status: trial.status, hasObservations: false });
  if (refusal) throw new AppError("CONFLICT", refusal);
}

export async function createInvitation(inviter: SessionUser, trial: Trial, input: { email: string; role: MembershipRole }): Promise<Invitation> {
  const sequelize = db();
  assertTeamOpen(trial);
  const existing = await User.findOne({ where: { email: input.email } });
  if (existing) {
    if (await Membership.findOne({ where: { trialId: trial.id, userId: existing.id } })) {
      throw new AppError("CONFLICT", `${existing.name} is already on this trial's team.`, [{ path: "email", message: "Already on the team." }]);
    }
    if (existing.role !== input.role) throw roleRefusalForInviter(input.email, existing.role, input.role);
  }
  const pending = await Invitation.findOne({ where: { trialId: trial.id, email: input.email, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } } });
  if (pending) {
    throw new AppError("CONFLICT", `${input.email} already has a pending invitation to this trial; resend it instead.`, [{ path: "email", message: "Already invited." }]);
  }
  const { token, hash } = newLinkToken();
  // One transaction: a failed queueing must not leave a pending invitation nobody was sent.
  const invitation = await sequelize.transaction(async (transaction) => {
    const created = await Invitation.create(
      { trialId: trial.id, email: input.email, role: input.role, tokenHash: hash, invitedById: inviter.id, expiresAt: new Date(Date.now() + INVITATION_LIFETIME_MS) },
      { transaction },
    );
    await queueInvitationMail(created, token, trial, inviter.name, transaction);
    return created;
  });
  wakeMailWorker();
  return invitation;
}

/**
 * A fresh link (the old one stops working) and a fresh lifetime. The new token and its mail
 * are stored in one transaction: if the mail cannot be queued, the old link keeps working.
 */
export async function resendInvitation(inviter: SessionUser, trial: Trial, invitation: Invitation): Promise<Invitation> {
  assertTeamOpen(trial);
  const sequelize = db();
  const { token, hash } = newLinkToken();
  try {
    await sequelize.transaction(async (transaction) => {
      // Locked so an acceptance in flight either finishes first or sees the new token.
      await invitation.reload({ transaction, lock: transaction.LOCK.UPDATE });
      const state = invitationState(invitation);
      if (state === "accepted" || state === "revoked") throw new AppError("CONFLICT", `This invitation was ${state}; invite the person again instead.`);
      await invitation.update({ tokenHash: hash, expiresAt: new Date(Date.now() + INVITATION_LIFETIME_MS), sentCount: invitation.sentCount + 1 }, { transaction });
      await queueInvitationMail(invitation, token, trial, inviter.name, transaction);
    });
  } catch (error) {
    // The instance already holds the new values; bring it back to what was kept.
    await invitation.reload().catch(() => undefined);
    throw error;
  }
  wakeMailWorker();
  return invitation;
}

export async function revokeInvitation(invitation: Invitation): Promise<Invitation> {
  if (invitation.acceptedAt) throw new AppError("CONFLICT", "This invitation was already accepted; remove the person from the team instead.");
  if (!invitation.revokedAt) await invitation.update({ revokedAt: new Date() });
  return invitation;
}

export interface InvitationView {
  invitation: Invitation;
  trial: Trial;
  inviterName: string;
  state: InvitationState;
  accountExists: boolean;
  /** The role of the account already registered for the invited address, if any. */
  accountRole: Role | null;
}

export async function invitationByToken(token: string): Promise<InvitationView | null> {
  db();
  const invitation = await Invitation.findOne({ where: { tokenHash: hashLinkToken(token) } });
  if (!invitation) return null;
  const [trial, inviter, account] = await Promise.all([
    Trial.findByPk(invitation.trialId),
    User.findByPk(invitation.invitedById, { attributes: ["name"] }),
    User.findOne({ where: { email: invitation.email }, attributes: ["id", "role"] }),
  ]);
  if (!trial) return null;
  return { invitation, trial, inviterName: inviter?.name ?? "the researcher", state: invitationState(invitation), accountExists: Boolean(account), accountRole: account?.role ?? null };
}

export interface AcceptOutcome {
  trialId: string;
  email: string;
  createdAccount: boolean;
}

/**
 * Uses the link once: the invitation is marked accepted by a conditional update inside the
 * transaction that adds the membership (and the account, for someone new), so two clicks
 * cannot both succeed and a failure leaves the link usable.
 */
export async function acceptInvitation(
  token: string,
  sessionUser: SessionUser | null,
  newAccount: { name?: string; password?: string },
): Promise<AcceptOutcome> {
  const sequelize = db();
  const view = await invitationByToken(token);
  if (!view) throw unknownLink();
  const { invitation, trial, inviterName } = view;
  if (view.state !== "pending") throw refusalFor(view.state, inviterName);
  assertTeamOpen(trial);
  // Before asking anyone to sign in: signing in with that account could not help.
  const roleRefusal = roleRefusalForInvitee(view);
  if (roleRefusal) throw roleRefusal;

  let user: User | null = null;
  if (sessionUser) {
    if (sessionUser.email !== invitation.email) {
      throw new AppError("FORBIDDEN", `This invitation is for ${invitation.email}, but you are signed in as ${sessionUser.email}. Sign out and open the link again.`);
    }
    user = await User.findByPk(sessionUser.id);
    if (!user || !user.active) throw new AppError("UNAUTHENTICATED", "Your session no longer matches an active account. Sign in again.");
  } else if (view.accountExists) {
    throw new AppError("UNAUTHENTICATED", `An account for ${invitation.email} exists. Sign in with it to accept the invitation.`);
  } else if (!newAccount.name || !newAccount.password) {
    throw new AppError("INVALID_INPUT", "Enter your name and a password to create your account.", [
      ...(!newAccount.name ? [{ path: "name", message: "Enter your name." }] : []),
      ...(!newAccount.password ? [{ path: "password", message: "Choose a password." }] : []),
    ]);
  }
  if (user) {
    const refusal = roleRefusalForInvitee({ invitation, accountRole: user.role, inviterName });
    if (refusal) throw refusal;
  }
  const passwordHash = user ? null : await hashPassword(newAccount.password!);

  try {
    return await sequelize.transaction(async (transaction) => {
      const claimed = await sequelize.query(
        `UPDATE invitations SET accepted_at = now(), updated_at = now()
         WHERE id = :id AND token_hash = :hash AND accepted_at IS NULL AND revoked_at IS NULL AND expires_at > now() RETURNING id`,
        { type: QueryTypes.SELECT, replacements: { id: invitation.id, hash: hashLinkToken(token) }, transaction },
      );
      if (claimed.length === 0) {
        await invitation.reload({ transaction });
        const state = invitationState(invitation);
        throw state === "pending" ? unknownLink() : refusalFor(state, inviterName);
      }
      const member =
        user ??
        (await User.create({ email: invitation.email, name: newAccount.name!, role: invitation.role, passwordHash: passwordHash! }, { transaction }));
      await Invitation.update({ acceptedById: member.id }, { where: { id: invitation.id }, transaction });
      const already = await Membership.findOne({ where: { trialId: trial.id, userId: member.id }, transaction });
      if (!already) await Membership.create({ trialId: trial.id, userId: member.id, role: invitation.role }, { transaction });
      return { trialId: trial.id, email: member.email, createdAccount: !user };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) {
      throw new AppError("CONFLICT", `An account for ${invitation.email} was just created. Sign in with it to accept the invitation.`);
    }
    throw error;
  }
}

export interface InvitationSummary {
  id: string;
  email: string;
  role: MembershipRole;
  state: InvitationState;
  expiresAt: Date;
  sentCount: number;
  createdAt: Date;
}

/** A trial's invitations, newest first; accepted and withdrawn ones stay visible for a record. */
export async function invitationsOf(trialId: string): Promise<InvitationSummary[]> {
  db();
  const rows = await Invitation.findAll({ where: { trialId }, order: [["createdAt", "DESC"]] });
  return rows.map((row) => ({ id: row.id, email: row.email, role: row.role, state: invitationState(row), expiresAt: row.expiresAt, sentCount: row.sentCount, createdAt: row.createdAt }));
}
