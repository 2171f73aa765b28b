import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { SessionUser } from "@/lib/auth/session";
import { hashPassword } from "@/lib/auth/password";
import { AppError } from "@/lib/errors";
import { acceptInvitation, createInvitation, invitationByToken, resendInvitation } from "@/lib/invitations/service";
import { processMailQueueOnce } from "@/lib/mail/queue";
import { hashLinkToken } from "@/lib/mail/tokens";
import { Invitation, MailMessage, Membership, User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { createPerson, rememberAddress, removePeople } from "./people";
import { acceptMailAgain, refuseMailTo } from "./refuse-mail";
import { caught, deadTransport, linkIn, mailTo, uniqueAddress, waitForMail } from "./support";

let fixture: TrialFixture;
let inviter: SessionUser;
const PASSWORD = "weeds-in-rows-1";

/** The link token in the newest invitation mail queued for `email` (read from the queue row). */
async function queuedToken(email: string): Promise<string> {
  const row = await MailMessage.findOne({ where: { toAddress: email, kind: "invitation" }, order: [["createdAt", "DESC"]] });
  const match = row?.textBody.match(/\/invite\/([A-Za-z0-9_-]+)/);
  if (!match) throw new Error(`no invitation mail queued for ${email}`);
  return match[1];
}

async function refusal(promise: Promise<unknown>): Promise<AppError> {
  const error = await promise.then(() => null, (caughtError: unknown) => caughtError);
  expect(error).toBeInstanceOf(AppError);
  return error as AppError;
}

function newAddress(label: string): string {
  const email = uniqueAddress(label);
  rememberAddress(email);
  return email;
}

async function accountFor(email: string, role: User["role"]): Promise<SessionUser> {
  const user = await User.create({ email, name: "Existing Account", role, passwordHash: await hashPassword(PASSWORD) });
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}

beforeAll(async () => {
  testDatabase();
  const owner = await createPerson("researcher", "owner");
  inviter = { id: owner.id, email: owner.email, name: owner.name, role: owner.role };
  fixture = await createTrialFixture({ ownerEmail: owner.email });
});

afterAll(async () => {
  await acceptMailAgain();
  await removeTrialFixtures();
  await removePeople();
});

describe("inviting while mail delivery is down", () => {
  it("the invitation succeeds, its mail waits in the queue, and goes out with a working link once delivery is back", async () => {
    const email = newAddress("offline");
    // An hour ahead on this process's clock only: the row is not due for the app server's own worker, so this test decides when it is sent.
    const later = new Date(Date.now() + 60 * 60_000);
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(later);
    const inviting = createInvitation(inviter, fixture.trial, { email, role: "technician" });
    let invitation: Invitation;
    try {
      invitation = await inviting;
    } finally {
      vi.useRealTimers();
    }
    expect((await Invitation.findByPk(invitation.id))?.email).toBe(email);

    const row = (await MailMessage.findOne({ where: { toAddress: email, kind: "invitation" } }))!;
    const down = await processMailQueueOnce({ transport: await deadTransport(), now: later, ids: [row.id] });
    expect(down).toEqual({ claimed: 1, sent: 0, retrying: 1, failed: 0 });
    await row.reload();
    expect(row.status).toBe("pending");
    expect(row.attempts).toBe(1);
    expect(row.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect((await caught()).filter(mailTo(email))).toHaveLength(0);

    const back = await processMailQueueOnce({ now: new Date(later.getTime() + 2 * 60_000), ids: [row.id] });
    expect(back).toEqual({ claimed: 1, sent: 1, retrying: 0, failed: 0 });
    const mail = await waitForMail(mailTo(email, "invites you"));
    const token = linkIn(mail, "/invite/").pathname.split("/")[2];
    expect(await acceptInvitation(token, null, { name: "Offline Tester", password: PASSWORD })).toEqual({ trialId: fixture.trial.id, email, createdAccount: true });
    const member = await User.findOne({ where: { email } });
    expect(await Membership.count({ where: { trialId: fixture.trial.id, userId: member!.id, role: "technician" } })).toBe(1);
  });
});

describe("existing accounts keep their role", () => {
  it("tells the inviter at once, and what to do instead", async () => {
    const grower = await createPerson("grower", "grower");
    const asGrower = await refusal(createInvitation(inviter, fixture.trial, { email: grower.email, role: "technician" }));
    expect(asGrower.code).toBe("CONFLICT");
    expect(asGrower.message).toBe(`${grower.email} already has a grower account, and an account keeps one role, so it cannot join this trial as a technician. Use another address to invite them.`);
    expect(asGrower.fields).toEqual([{ path: "role", message: asGrower.message }]);

    const reviewer = await createPerson("reviewer", "rev");
    const asTechnician = await refusal(createInvitation(inviter, fixture.trial, { email: reviewer.email, role: "technician" }));
    expect(asTechnician.message).toBe(`${reviewer.email} already has a reviewer account, and an account keeps one role, so it cannot join this trial as a technician. Invite them as a reviewer instead, or use another address.`);
    expect(await Invitation.count({ where: { email: [grower.email, reviewer.email] } })).toBe(0);
    expect(await MailMessage.count({ where: { toAddress: [grower.email, reviewer.email] } })).toBe(0);
  });

  it("tells the invitee on accepting when the address got an account of another role since, and keeps the link usable", async () => {
    const email = newAddress("switched");
    await createInvitation(inviter, fixture.trial, { email, role: "technician" });
    const token = await queuedToken(email);
    const account = await accountFor(email, "reviewer");
    const expected = `This invitation is for a technician, but ${email} already has a reviewer account, and an account keeps one role. Ask ${inviter.name} to invite you as a reviewer, or at another address.`;

    expect((await invitationByToken(token))?.accountRole).toBe("reviewer");
    for (const sessionUser of [null, account]) {
      const refused = await refusal(acceptInvitation(token, sessionUser, {}));
      expect(refused.code).toBe("CONFLICT");
      expect(refused.message).toBe(expected);
    }
    const stored = await Invitation.findOne({ where: { email } });
    expect(stored?.acceptedAt).toBeNull();
    expect(await Membership.count({ where: { trialId: fixture.trial.id, userId: account.id } })).toBe(0);
  });
});

describe("a link and its mail are stored together", () => {
  it("an invitation whose mail cannot be queued is not kept", async () => {
    const email = newAddress("unqueued");
    await refuseMailTo(email);
    try {
      await expect(createInvitation(inviter, fixture.trial, { email, role: "technician" })).rejects.toThrow("mail queue refused the row");
    } finally {
      await acceptMailAgain();
    }
    expect(await Invitation.count({ where: { email } })).toBe(0);
  });

  it("a resend whose mail cannot be queued keeps the old link working; a resend that is queued replaces it", async () => {
    const email = newAddress("resend");
    const invitation = await createInvitation(inviter, fixture.trial, { email, role: "technician" });
    const first = await queuedToken(email);

    await refuseMailTo(email);
    try {
      await expect(resendInvitation(inviter, fixture.trial, invitation)).rejects.toThrow("mail queue refused the row");
    } finally {
      await acceptMailAgain();
    }
    const kept = (await Invitation.findByPk(invitation.id))!;
    expect(kept.tokenHash).toBe(hashLinkToken(first));
    expect(kept.sentCount).toBe(1);
    expect(invitation.sentCount).toBe(1);
    expect(await MailMessage.count({ where: { toAddress: email, kind: "invitation" } })).toBe(1);

    const resent = await resendInvitation(inviter, fixture.trial, invitation);
    expect(resent.sentCount).toBe(2);
    const second = await queuedToken(email);
    expect(second).not.toBe(first);
    expect((await Invitation.findByPk(invitation.id))!.tokenHash).toBe(hashLinkToken(second));
    expect((await refusal(acceptInvitation(first, null, { name: "Old Link", password: PASSWORD }))).code).toBe("NOT_FOUND");
    expect(await acceptInvitation(second, null, { name: "New Link", password: PASSWORD })).toEqual({ trialId: fixture.trial.id, email, createdAccount: true });
  });
});
