import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Op } from "sequelize";
import { processMailQueueOnce } from "@/lib/mail/queue";
import { sendAssessmentDueReminders } from "@/lib/notifications/assessment-due";
import { sendDailyDigests } from "@/lib/notifications/digest";
import { notify } from "@/lib/notifications/notify";
import { saveNotificationPreferences } from "@/lib/notifications/settings";
import { Follow, MailMessage, Membership, NotificationDigestItem, type User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { createPerson, removePeople } from "./people";
import { caught, deadTransport, mailTo, waitForMail } from "./support";

let fixture: TrialFixture;
let owner: User;
let technician: User;
let reviewer: User;
let grower: User;

/** Mail queued for this fixture's trial since `since`, by recipient. */
async function queuedSince(since: Date, subjectPart: string): Promise<MailMessage[]> {
  return MailMessage.findAll({ where: { createdAt: { [Op.gte]: since }, subject: { [Op.like]: `%${subjectPart}%` } } });
}

async function deliver(rows: MailMessage[]): Promise<void> {
  await processMailQueueOnce({ ids: rows.map((row) => row.id) });
}

beforeAll(async () => {
  testDatabase();
  owner = await createPerson("researcher", "owner");
  technician = await createPerson("technician", "tech");
  reviewer = await createPerson("reviewer", "rev");
  grower = await createPerson("grower", "grower");
  fixture = await createTrialFixture({ ownerEmail: owner.email });
  await Membership.create({ trialId: fixture.trial.id, userId: technician.id, role: "technician" });
  await Membership.create({ trialId: fixture.trial.id, userId: reviewer.id, role: "reviewer" });
});

afterAll(async () => {
  await removeTrialFixtures();
  await removePeople();
});

const trialTitle = () => fixture.trial.title;

describe("notify() turns events into mail for the right people", () => {
  it("upload committed → the researcher who owns the trial, with a working absolute link", async () => {
    const since = new Date();
    await notify({ type: "upload-committed", trialId: fixture.trial.id, assessmentId: fixture.assessment.id, versionNumber: 2, actorId: technician.id });
    const rows = await queuedSince(since, trialTitle());
    expect(rows.map((row) => row.toAddress)).toEqual([owner.email]);
    await deliver(rows);
    const mail = await waitForMail(mailTo(owner.email, "New data"));
    expect(mail.text).toContain("uploaded version 2");
    expect(mail.text).toContain(`${process.env.APP_BASE_URL}/trials/${fixture.trial.id}/data/${fixture.assessment.id}`);
    expect(mail.html).toContain(`href="${process.env.APP_BASE_URL}/trials/${fixture.trial.id}/data/${fixture.assessment.id}"`);
  });

  it("review requested → the trial's reviewers", async () => {
    const since = new Date();
    await notify({ type: "review-requested", trialId: fixture.trial.id, actorId: owner.id });
    const rows = await queuedSince(since, trialTitle());
    expect(rows.map((row) => row.toAddress)).toEqual([reviewer.email]);
    await deliver(rows);
    await waitForMail(mailTo(reviewer.email, "Review requested"));
  });

  it("comment added → the owner and reviewers, never the author", async () => {
    const since = new Date();
    await notify({ type: "comment-added", trialId: fixture.trial.id, assessmentId: null, commentId: "c-1", actorId: reviewer.id });
    const rows = await queuedSince(since, trialTitle());
    expect(rows.map((row) => row.toAddress)).toEqual([owner.email]);
  });

  it("trial approved → the owner and technicians", async () => {
    const since = new Date();
    await notify({ type: "trial-approved", trialId: fixture.trial.id, actorId: reviewer.id });
    const rows = await queuedSince(since, trialTitle());
    expect(rows.map((row) => row.toAddress).sort()).toEqual([owner.email, technician.email].sort());
    await deliver(rows);
    await waitForMail(mailTo(technician.email, "Approved"));
  });

  it("trial published → people following the crop or one of its methods, once each", async () => {
    const since = new Date();
    const methodFollower = await createPerson("grower", "handweeder");
    await Follow.create({ userId: grower.id, kind: "crop", value: "lettuce" });
    await Follow.create({ userId: grower.id, kind: "method", value: "hand" });
    await Follow.create({ userId: methodFollower.id, kind: "method", value: "hand" });
    await Follow.create({ userId: owner.id, kind: "crop", value: "onion" });
    await notify({ type: "trial-published", trialId: fixture.trial.id, actorId: owner.id });
    const rows = await queuedSince(since, trialTitle());
    expect(rows.map((row) => row.toAddress).sort()).toEqual([grower.email, methodFollower.email].sort());
    await deliver(rows);
    const mail = await waitForMail(mailTo(grower.email, "lettuce results"));
    expect(mail.text).toContain(`${process.env.APP_BASE_URL}/library/${fixture.trial.id}`);
  });

  it("assessment due tomorrow → the technicians and the owner, from the daily job", async () => {
    const now = new Date();
    const tomorrow = new Date(now.getTime() + 86_400_000).toISOString().slice(0, 10);
    await fixture.assessment.update({ plannedDate: tomorrow });
    const since = new Date();
    expect(await sendAssessmentDueReminders(now)).toBeGreaterThanOrEqual(2);
    const rows = await queuedSince(since, trialTitle());
    expect(rows.map((row) => row.toAddress).sort()).toEqual([owner.email, technician.email].sort());
    expect(rows[0].subject).toContain("Due tomorrow");
  });
});

describe("settings decide what is sent", () => {
  it("a muted kind is not sent; a digest reader gets one daily mail instead", async () => {
    await saveNotificationPreferences(owner.id, { delivery: "immediate", muted: ["upload-committed"] });
    let since = new Date();
    await notify({ type: "upload-committed", trialId: fixture.trial.id, assessmentId: fixture.assessment.id, versionNumber: 3, actorId: technician.id });
    expect(await queuedSince(since, trialTitle())).toHaveLength(0);

    await saveNotificationPreferences(owner.id, { delivery: "digest", muted: [] });
    since = new Date();
    await notify({ type: "upload-committed", trialId: fixture.trial.id, assessmentId: fixture.assessment.id, versionNumber: 4, actorId: technician.id });
    await notify({ type: "comment-added", trialId: fixture.trial.id, assessmentId: fixture.assessment.id, commentId: "c-2", actorId: reviewer.id });
    expect(await queuedSince(since, trialTitle())).toHaveLength(0);
    expect(await NotificationDigestItem.count({ where: { userId: owner.id, digestedAt: null } })).toBe(2);

    expect(await sendDailyDigests(new Date())).toBeGreaterThanOrEqual(1);
    expect(await NotificationDigestItem.count({ where: { userId: owner.id, digestedAt: null } })).toBe(0);
    const [digest] = await MailMessage.findAll({ where: { toAddress: owner.email, kind: "digest" } });
    await deliver([digest]);
    const mail = await waitForMail(mailTo(owner.email, "digest: 2 notices"));
    expect(mail.text).toContain("uploaded version 4");
    expect(mail.text).toContain("commented on");
    // A second run finds nothing new to send.
    expect(await MailMessage.count({ where: { toAddress: owner.email, kind: "digest" } })).toBe(1);
    await saveNotificationPreferences(owner.id, { delivery: "immediate", muted: [] });
  });
});

describe("sending never breaks the action that triggered it", () => {
  it("notify() resolves even for an event it cannot place", async () => {
    await expect(notify({ type: "trial-approved", trialId: "00000000-0000-4000-8000-000000000000", actorId: owner.id })).resolves.toBeUndefined();
  });

  it("with the catcher down the notice waits in the queue and goes out when it is back", async () => {
    const since = new Date();
    await notify({ type: "review-requested", trialId: fixture.trial.id, actorId: owner.id });
    const rows = await queuedSince(since, trialTitle());
    expect(rows).toHaveLength(1);
    // The app server's own worker may already have sent it; only a still-pending row can be failed here.
    const down = await processMailQueueOnce({ transport: await deadTransport(), ids: rows.map((row) => row.id) });
    await rows[0].reload();
    if (down.claimed === 1) {
      expect(rows[0].status).toBe("pending");
      expect(rows[0].lastError).toBeTruthy();
      await processMailQueueOnce({ ids: [rows[0].id], now: new Date(Date.now() + 61_000) });
    }
    await waitForMail((mail) => mailTo(reviewer.email, "Review requested")(mail) && Date.parse(mail.receivedAt) >= since.getTime() - 1000);
    await rows[0].reload();
    expect(rows[0].status).toBe("sent");
    expect((await caught()).filter(mailTo(reviewer.email, "Review requested")).length).toBeGreaterThanOrEqual(2);
  });
});
