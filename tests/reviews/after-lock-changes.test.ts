import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Op } from "sequelize";
import { AuditEvent, DatasetVersion, MailMessage, Membership, type User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { createPerson, PERSON_PASSWORD, removePeople } from "../mail/people";
import { testDatabase } from "../support/database";
import { TestClient } from "../support/http";

/*
 * "After a trial is locked, a change needs a written reason and is shown to the reviewer":
 * through the real API, the review page, the version's changes page and the mail queue.
 */

let fixture: TrialFixture;
let owner: User;
let technicianUser: User;
let firstReviewer: User;
let secondReviewer: User;
let ownerClient: TestClient;
let technician: TestClient;
let reviewer: TestClient;

const REASON = "Plot 102 was keyed from the wrong field sheet.";
const ENTRY_REASON = "Quadrat 1 of plot 203 recounted with the reviewer present.";

async function signedIn(user: User): Promise<TestClient> {
  const client = new TestClient();
  if (!(await client.signIn(user.email, PERSON_PASSWORD))) throw new Error(`could not sign in as ${user.email}`);
  return client;
}

function densityFile(value: (plotNumber: number, quadrat: number) => number): string {
  return ["plot,quadrat,value", ...fixture.plots.flatMap((plot) => [1, 2].map((quadrat) => `${plot.number},${quadrat},${value(plot.number, quadrat)}`))].join("\n");
}

async function uploadAndCheck(content: string, fileName: string): Promise<string> {
  const bytes = new TextEncoder().encode(content);
  const started = await technician.request("/api/uploads", {
    method: "POST",
    json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, fileName, sizeBytes: bytes.byteLength },
  });
  expect(started.status).toBe(201);
  const { uploadId, putUrl, contentType } = await started.json();
  expect((await fetch(putUrl, { method: "PUT", headers: { "content-type": contentType }, body: Buffer.from(bytes) })).status).toBe(200);
  const checked = await technician.request(`/api/uploads/${uploadId}/check`, { method: "POST" });
  expect((await checked.json()).status).toBe("checked");
  return uploadId;
}

/** Notices about this fixture's trial of one kind, queued since `since`, by recipient. */
async function noticesSince(since: Date, type: string): Promise<MailMessage[]> {
  return MailMessage.findAll({ where: { createdAt: { [Op.gte]: since }, kind: `notice:${type}`, subject: { [Op.like]: `%${fixture.trial.title}%` } }, order: [["toAddress", "ASC"]] });
}

/** A page's visible text: React's text separators and inline tags dropped, block tags as spaces. */
function textOf(html: string): string {
  return html
    .replace(/<!-- -->/g, "")
    .replace(/<\/?(?:span|a|strong)\b[^>]*>/g, "")
    .replace(/<[^>]+>/g, " ")
    .replace(/&#x27;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, "&")
    .replace(/\s+/g, " ");
}

function section(html: string, testId: string): string {
  const start = html.indexOf(`data-testid="${testId}"`);
  expect(start).toBeGreaterThan(-1);
  return html.slice(start, html.indexOf("</section>", start));
}

beforeAll(async () => {
  testDatabase();
  owner = await createPerson("researcher", "owner");
  technicianUser = await createPerson("technician", "tech");
  firstReviewer = await createPerson("reviewer", "first");
  secondReviewer = await createPerson("reviewer", "second");
  fixture = await createTrialFixture({ ownerEmail: owner.email });
  await Membership.create({ trialId: fixture.trial.id, userId: technicianUser.id, role: "technician" });
  await Membership.create({ trialId: fixture.trial.id, userId: firstReviewer.id, role: "reviewer" });
  await Membership.create({ trialId: fixture.trial.id, userId: secondReviewer.id, role: "reviewer" });
  [ownerClient, technician, reviewer] = await Promise.all([signedIn(owner), signedIn(technicianUser), signedIn(firstReviewer)]);
});

afterAll(async () => {
  await removeTrialFixtures();
  await removePeople();
  await testDatabase().close();
});

describe("data changed after the lock", () => {
  it("before the lock: a version tells the owner, not the reviewers", async () => {
    const since = new Date();
    const uploadId = await uploadAndCheck(densityFile((plot, quadrat) => (plot % 100) + quadrat), "first.csv");
    const commit = await technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
    expect(commit.status).toBe(201);
    expect((await commit.json()).number).toBe(1);
    expect(await noticesSince(since, "data-changed-after-lock")).toEqual([]);
    expect((await noticesSince(since, "upload-committed")).map((row) => row.toAddress)).toEqual([owner.email]);
  });

  it("the trial is approved and locked through the review API", async () => {
    expect((await ownerClient.request(`/api/reviews/${fixture.trial.id}/request`, { method: "POST", json: { message: "Density is in." } })).status).toBe(201);
    expect((await reviewer.request(`/api/reviews/${fixture.trial.id}/approve`, { method: "POST", json: { note: "Approved." } })).status).toBe(200);
  });

  it("an upload without a reason is refused and writes nothing", async () => {
    const since = new Date();
    const uploadId = await uploadAndCheck(densityFile(() => 9), "no-reason.csv");
    const commit = await technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
    expect(commit.status).toBe(422);
    expect((await commit.json()).error.message).toBe("This trial is locked after review: say why the data change. The reviewer will see your reason.");
    expect(await DatasetVersion.count({ where: { assessmentId: fixture.assessment.id } })).toBe(1);
    expect(await noticesSince(since, "data-changed-after-lock")).toEqual([]);
  });

  it("an upload with a reason becomes a version, and every reviewer is told what, who and why", async () => {
    const since = new Date();
    const uploadId = await uploadAndCheck(densityFile((plot, quadrat) => (plot === 102 ? 30 + quadrat : (plot % 100) + quadrat)), "corrected.csv");
    const commit = await technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: { reason: REASON } });
    expect(commit.status).toBe(201);
    expect((await commit.json()).number).toBe(2);

    const notices = await noticesSince(since, "data-changed-after-lock");
    expect(notices.map((row) => row.toAddress)).toEqual([firstReviewer.email, secondReviewer.email].sort());
    for (const notice of notices) {
      expect(notice.subject).toBe(`Data changed after lock: ${fixture.trial.title}`);
      expect(notice.textBody).toContain(`Tech Tester changed the data for “${fixture.assessment.name}” in the trial “${fixture.trial.title}” after it was approved and locked; the change is version 2.`);
      expect(notice.textBody).toContain(`Reason given: ${REASON}`);
      expect(notice.textBody).toContain(`${process.env.APP_BASE_URL}/trials/${fixture.trial.id}/data/${fixture.assessment.id}/versions/2`);
    }
    // The owner still hears of the upload as before.
    expect((await noticesSince(since, "upload-committed")).map((row) => row.toAddress)).toEqual([owner.email]);
  });

  it("a per-plot entry after the lock tells the reviewers too, unless one has muted that kind of notice", async () => {
    const muted = await signedIn(secondReviewer);
    const saved = await muted.request("/api/notification-settings", { method: "PUT", json: { delivery: "immediate", muted: ["data-changed-after-lock"] } });
    expect(saved.status).toBe(200);
    expect((await saved.json()).muted).toEqual(["data-changed-after-lock"]);

    const since = new Date();
    const entry = await technician.request("/api/plot-entries", {
      method: "POST",
      json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, plotNumber: 203, values: [{ quadrat: 1, value: 17 }, { quadrat: 2, value: 5 }], reason: ENTRY_REASON },
    });
    expect(entry.status).toBe(201);
    expect((await entry.json()).number).toBe(3);
    const notices = await noticesSince(since, "data-changed-after-lock");
    expect(notices.map((row) => row.toAddress)).toEqual([firstReviewer.email]);
    expect(notices[0].textBody).toContain(`Reason given: ${ENTRY_REASON}`);
    expect(notices[0].textBody).toContain(`/trials/${fixture.trial.id}/data/${fixture.assessment.id}/versions/3`);
  });

  it("the review page lists each change after the lock: when, who, assessment, version, reason and a link", async () => {
    const response = await reviewer.request(`/trials/${fixture.trial.id}/review`);
    expect(response.status).toBe(200);
    const html = section(await response.text(), "changes-after-lock");
    const text = textOf(html);
    expect(text).toContain("Data changed after the lock");
    expect(text).toContain("2 data changes were made after the trial was locked.");
    expect(html.match(/data-testid="change-after-lock"/g)).toHaveLength(2);

    const events = await AuditEvent.findAll({ where: { trialId: fixture.trial.id, afterLock: true }, order: [["id", "DESC"]] });
    expect(events.map((event) => event.reason)).toEqual([ENTRY_REASON, REASON]);
    const stamp = (event: AuditEvent) => `${event.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC`;
    // Newest first.
    const newest = text.indexOf(`${fixture.assessment.name}, version 3 · Tech Tester · ${stamp(events[0])} · per-plot entry Reason: ${ENTRY_REASON}`);
    const older = text.indexOf(`${fixture.assessment.name}, version 2 · Tech Tester · ${stamp(events[1])} · upload of corrected.csv Reason: ${REASON}`);
    expect(newest).toBeGreaterThan(-1);
    expect(older).toBeGreaterThan(newest);
    expect(text).not.toContain("version 1 ·");
    for (const number of [2, 3]) expect(html).toContain(`href="/trials/${fixture.trial.id}/data/${fixture.assessment.id}/versions/${number}"`);
  });

  it("the version's changes page shows who, when, the source, the lock and the reason, then each old and new value", async () => {
    const response = await reviewer.request(`/trials/${fixture.trial.id}/data/${fixture.assessment.id}/versions/2`);
    expect(response.status).toBe(200);
    const text = textOf(await response.text());
    const version = await DatasetVersion.findOne({ where: { assessmentId: fixture.assessment.id, number: 2 } });
    expect(text).toContain(`Upload of corrected.csv by Tech Tester, ${version!.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC`);
    expect(text).toContain("Made after the trial was locked");
    expect(text).toContain(`Reason given: ${REASON}`);
    // Plot 102 went from 3 and 4 to 31 and 32; nothing else changed.
    expect(text).toContain("2 values differ from the version before");
    expect(text).toContain("102 1 – 3 31");
    expect(text).toContain("102 2 – 4 32");

    const first = textOf(await (await reviewer.request(`/trials/${fixture.trial.id}/data/${fixture.assessment.id}/versions/1`)).text());
    expect(first).toContain("Upload of first.csv by Tech Tester");
    expect(first).not.toContain("Made after the trial was locked");
  });

  it("the audit trail links every data version to its changes", async () => {
    const response = await reviewer.request(`/trials/${fixture.trial.id}/audit`);
    expect(response.status).toBe(200);
    const html = await response.text();
    for (const number of [1, 2, 3]) expect(html).toContain(`href="/trials/${fixture.trial.id}/data/${fixture.assessment.id}/versions/${number}"`);
    expect(textOf(html)).toContain("2 changes were made after the trial was locked.");
  });
});
