import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { DatasetVersion, Membership, Upload, User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { signedInAs, type TestClient } from "../support/http";
import { QueryTypes } from "sequelize";
import { bringDatabaseBack, holdTable, startFakesAgain, stopFakes, takeDatabaseDownUnder } from "../support/services";

let fixture: TrialFixture;
let technician: TestClient;

function file(): string {
  return ["plot,quadrat,value", ...fixture.plots.flatMap((plot) => [1, 2].map((quadrat) => `${plot.number},${quadrat},${quadrat + 1}`))].join("\n");
}

async function sendAndCheck(): Promise<string> {
  const bytes = Buffer.from(file());
  const started = await technician.request("/api/uploads", { method: "POST", json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, fileName: "d.csv", sizeBytes: bytes.byteLength } });
  const { uploadId, putUrl, contentType } = await started.json();
  expect((await fetch(putUrl, { method: "PUT", headers: { "content-type": contentType }, body: bytes })).status).toBe(200);
  return uploadId;
}

async function untilOk(attempt: () => Promise<Response>): Promise<Response> {
  let response = await attempt();
  for (let tries = 0; tries < 20 && response.status >= 500; tries += 1) {
    await new Promise((resolve) => setTimeout(resolve, 250));
    response = await attempt();
  }
  return response;
}

beforeAll(async () => {
  fixture = await createTrialFixture();
  const user = await User.findOne({ where: { email: "technician@hoebench.test" } });
  await Membership.create({ trialId: fixture.trial.id, userId: user!.id, role: "technician" });
  technician = await signedInAs("technician@hoebench.test");
});

afterEach(async () => {
  await bringDatabaseBack();
});

describe("when PostgreSQL goes away", () => {
  it("in the middle of a commit, the commit is refused with a clear message, writes nothing, and succeeds once the database is back", async () => {
    const uploadId = await sendAndCheck();
    expect((await technician.request(`/api/uploads/${uploadId}/check`, { method: "POST" })).status).toBe(200);

    // The commit gets as far as its audit entry, with the version and its values written, then loses the database.
    const hold = await holdTable("audit_events");
    const answer = technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
    try {
      takeDatabaseDownUnder(await hold.waiter('INSERT INTO "audit_events"'));
    } finally {
      await hold.release();
    }
    const refused = await answer;
    expect(refused.status).toBe(503);
    expect(await refused.json()).toEqual({ error: { code: "UNAVAILABLE", message: "The database is not answering. Nothing was saved; try again in a minute." } });
    await bringDatabaseBack();

    expect(await DatasetVersion.count({ where: { assessmentId: fixture.assessment.id } })).toBe(0);
    const [{ values }] = await testDatabase().query<{ values: number }>("SELECT count(*)::int AS values FROM observations WHERE assessment_id = :assessmentId", {
      replacements: { assessmentId: fixture.assessment.id },
      type: QueryTypes.SELECT,
    });
    expect(values).toBe(0);
    expect((await Upload.findByPk(uploadId))?.status).toBe("checked");
    const committed = await untilOk(() => technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} }));
    expect(committed.status).toBe(201);
    expect((await committed.json()).number).toBe(1);
  });
});

describe("when object storage goes away", () => {
  it("the check says so, nothing is recorded, and the same file goes through once storage is back", async () => {
    const uploadId = await sendAndCheck();
    await stopFakes();
    try {
      const refused = await technician.request(`/api/uploads/${uploadId}/check`, { method: "POST" });
      expect(refused.status).toBe(503);
      expect((await refused.json()).error.message).toBe("File storage is not answering. Nothing was recorded; try again in a minute.");
      expect((await Upload.findByPk(uploadId))?.status).toBe("pending");
    } finally {
      await startFakesAgain();
    }
    const checked = await untilOk(() => technician.request(`/api/uploads/${uploadId}/check`, { method: "POST" }));
    expect(checked.status).toBe(200);
    expect((await checked.json()).status).toBe("checked");
  });
});

afterAll(async () => {
  await bringDatabaseBack();
  await removeTrialFixtures();
  await testDatabase().close();
});
