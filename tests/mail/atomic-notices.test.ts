import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { Op } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { notify } from "@/lib/notifications/notify";
import { addComment, approveTrial, requestReview, withdrawReview } from "@/lib/reviews/service";
import { AuditEvent, MailMessage, Membership, ReviewComment, ReviewRequest, Trial, type User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { createPerson, removePeople } from "./people";
import { acceptMailAgain, refuseMailTo } from "./refuse-mail";

let fixture: TrialFixture;
let owner: User;
let technician: User;
let reviewer: User;

/** "recipient: subject" of every notice queued for this suite's trial since `since`. */
async function queuedSince(since: Date): Promise<string[]> {
  const rows = await MailMessage.findAll({ where: { createdAt: { [Op.gte]: since }, subject: { [Op.like]: `%${fixture.trial.title}%` } } });
  return rows.map((row) => `${row.toAddress}: ${row.subject}`).sort();
}

beforeAll(async () => {
  testDatabase();
  owner = await createPerson("researcher", "owner");
  technician = await createPerson("technician", "tech");
  reviewer = await createPerson("reviewer", "rev");
  fixture = await createTrialFixture({ ownerEmail: owner.email });
  await Membership.create({ trialId: fixture.trial.id, userId: technician.id, role: "technician" });
  await Membership.create({ trialId: fixture.trial.id, userId: reviewer.id, role: "reviewer" });
});

afterAll(async () => {
  await acceptMailAgain();
  await removeTrialFixtures();
  await removePeople();
});

describe("notices queued in the action's transaction", () => {
  it("roll back with an action that fails after notifying", async () => {
    const since = new Date();
    await expect(
      db().transaction(async (transaction) => {
        await notify({ type: "review-requested", trialId: fixture.trial.id, actorId: owner.id }, { transaction });
        expect(await MailMessage.count({ where: { toAddress: reviewer.email, createdAt: { [Op.gte]: since } }, transaction })).toBe(1);
        throw new Error("the action failed after notifying");
      }),
    ).rejects.toThrow("the action failed after notifying");
    expect(await queuedSince(since)).toEqual([]);
  });

  it("commit with the action: asking for review queues the reviewers' notice by the time it returns", async () => {
    const since = new Date();
    const request = await requestReview(fixture.trial, owner.id, "Please check the weed counts.");
    expect(await queuedSince(since)).toEqual([`${reviewer.email}: Review requested: ${fixture.trial.title}`]);
    await withdrawReview(fixture.trial, owner.id);
    expect((await ReviewRequest.findByPk(request.id))!.status).toBe("withdrawn");
  });

  it("a queue that fails inside the transaction costs the notice, never the action", async () => {
    const since = new Date();
    await refuseMailTo(reviewer.email);
    const logged = vi.spyOn(console, "error").mockImplementation(() => {});
    const asked = requestReview(fixture.trial, owner.id, "Second round.");
    let request: ReviewRequest;
    let logs: unknown[][];
    try {
      request = await asked;
    } finally {
      logs = [...logged.mock.calls];
      logged.mockRestore();
      await acceptMailAgain();
    }
    expect(logs).toEqual([["notification could not be queued", "review-requested", expect.objectContaining({ message: expect.stringContaining("mail queue refused the row") })]]);
    const stored = await ReviewRequest.findByPk(request.id);
    expect(stored?.status).toBe("requested");
    expect(stored?.message).toBe("Second round.");
    expect(await AuditEvent.count({ where: { entityId: request.id, summary: "Review requested" } })).toBe(1);
    expect(await queuedSince(since)).toEqual([]);
  });

  it("comments and approval queue their notices with them", async () => {
    const since = new Date();
    const comment = await addComment(fixture.trial, reviewer.id, { body: "Block 3 looks trampled.", assessmentId: fixture.assessment.id, parentId: null });
    expect(await ReviewComment.count({ where: { id: comment.id } })).toBe(1);
    await approveTrial(fixture.trial, reviewer.id, "Counts agree with the field notes.");
    expect((await Trial.findByPk(fixture.trial.id))!.status).toBe("locked");
    expect(await queuedSince(since)).toEqual(
      [
        `${owner.email}: New comment on ${fixture.trial.title}`,
        `${owner.email}: Approved: ${fixture.trial.title}`,
        `${technician.email}: Approved: ${fixture.trial.title}`,
      ].sort(),
    );
  });
});
