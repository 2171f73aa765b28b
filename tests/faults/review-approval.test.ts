import { afterAll, afterEach, describe, expect, it } from "vitest";
import { AuditEvent, Membership, Trial, User } from "@/models";
import { createTrialFixture, removeTrialFixtures } from "../factories/trials";
import { testDatabase } from "../support/database";
import { signedInAs } from "../support/http";
import { bringDatabaseBack, holdTable, takeDatabaseDownUnder } from "../support/services";

afterEach(async () => {
  await bringDatabaseBack();
});

describe("when PostgreSQL goes away during a review approval", () => {
  it("the reviewer is told plainly, the trial stays unlocked, and approving works once the database is back", async () => {
    const fixture = await createTrialFixture();
    const reviewer = await User.findOne({ where: { email: "reviewer@hoebench.test" } });
    await Membership.create({ trialId: fixture.trial.id, userId: reviewer!.id, role: "reviewer" });
    const researcherClient = await signedInAs("researcher@hoebench.test");
    const reviewerClient = await signedInAs("reviewer@hoebench.test");
    expect((await researcherClient.request(`/api/reviews/${fixture.trial.id}/request`, { method: "POST", json: { message: "Ready for review." } })).status).toBe(201);

    // The approval gets as far as its audit entry, then loses the database.
    const hold = await holdTable("audit_events");
    const answer = reviewerClient.request(`/api/reviews/${fixture.trial.id}/approve`, { method: "POST", json: { note: "Tables read." } });
    try {
      takeDatabaseDownUnder(await hold.waiter('INSERT INTO "audit_events"'));
    } finally {
      await hold.release();
    }
    const refused = await answer;
    expect(refused.status).toBe(503);
    expect((await refused.json()).error.message).toBe("The database is not answering. Nothing was saved; try again in a minute.");
    await bringDatabaseBack();

    testDatabase();
    const untilBack = async () => {
      for (let attempt = 0; attempt < 20; attempt += 1) {
        try {
          return await Trial.findByPk(fixture.trial.id);
        } catch {
          await new Promise((resolve) => setTimeout(resolve, 250));
        }
      }
      throw new Error("the database did not come back");
    };
    expect((await untilBack())?.status).toBe("active");
    expect(await AuditEvent.count({ where: { trialId: fixture.trial.id, entityType: "trial" } })).toBe(0);

    let approved = await reviewerClient.request(`/api/reviews/${fixture.trial.id}/approve`, { method: "POST", json: { note: "Tables read." } });
    for (let attempt = 0; attempt < 20 && approved.status >= 500; attempt += 1) {
      await new Promise((resolve) => setTimeout(resolve, 250));
      approved = await reviewerClient.request(`/api/reviews/${fixture.trial.id}/approve`, { method: "POST", json: { note: "Tables read." } });
    }
    expect(approved.status).toBe(200);
    expect((await Trial.findByPk(fixture.trial.id))?.status).toBe("locked");
  });
});

afterAll(async () => {
  await bringDatabaseBack();
  await removeTrialFixtures();
  await testDatabase().close();
});
