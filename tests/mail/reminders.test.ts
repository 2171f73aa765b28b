import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { Op } from "sequelize";
import { runDueDailyJobs, type DailyJob } from "@/lib/jobs/daily";
import { sendAssessmentDueReminders } from "@/lib/notifications/assessment-due";
import { saveNotificationPreferences } from "@/lib/notifications/settings";
import { Assessment, MailMessage, Membership, NotificationDigestItem, type User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { createPerson, removePeople } from "./people";

// A fixed morning years ahead, so no demo assessment is due on the same day.
const now = new Date("2031-06-10T06:30:00Z");
const tomorrow = "2031-06-11";

let fixture: TrialFixture;
let owner: User;
let technician: User;
let planned: Assessment;
let afterPlanting: Assessment;

async function addAssessment(position: number, name: string, timing: Pick<Assessment, "plannedDate" | "timingDays" | "timingReference">): Promise<Assessment> {
  return Assessment.create({ trialId: fixture.trial.id, position, name, variable: "weed-density", unit: "plants per quadrat", quadratsPerPlot: 2, plausibleMin: 0, plausibleMax: 500, ...timing });
}

/** Reminder mail queued for this suite's trial, as "assessment name → recipient" lines. */
async function reminders(): Promise<string[]> {
  const rows = await MailMessage.findAll({ where: { kind: "notice:assessment-due", subject: { [Op.like]: `%${fixture.trial.title}%` } } });
  return rows.map((row) => `${row.subject.replace(/^Due tomorrow: (.*) \(.*\)$/, "$1")} → ${row.toAddress}`).sort();
}

beforeAll(async () => {
  testDatabase();
  owner = await createPerson("researcher", "owner");
  technician = await createPerson("technician", "tech");
  fixture = await createTrialFixture({ ownerEmail: owner.email });
  await Membership.create({ trialId: fixture.trial.id, userId: technician.id, role: "technician" });
  // Planted 21 days before tomorrow.
  await fixture.trial.update({ plantingDate: "2031-05-21" });
  planned = fixture.assessment;
  await planned.update({ name: "Planned count", plannedDate: tomorrow, timingDays: null, timingReference: null });
  afterPlanting = await addAssessment(2, "Count 21 days after planting", { plannedDate: null, timingDays: 21, timingReference: "planting" });
  await addAssessment(3, "Count 20 days after planting", { plannedDate: null, timingDays: 20, timingReference: "planting" });
  await addAssessment(4, "Count 7 days after treatment", { plannedDate: null, timingDays: 7, timingReference: "treatment" });
  // A planned date wins over the timing, as on the schedule page: due on the 12th, not tomorrow.
  await addAssessment(5, "Rescheduled count", { plannedDate: "2031-06-12", timingDays: 21, timingReference: "planting" });
});

afterAll(async () => {
  await removeTrialFixtures();
  await removePeople();
});

describe("assessment due tomorrow", () => {
  it("reminds the owner and technicians of planned and days-after-planting assessments, once each", async () => {
    expect(await sendAssessmentDueReminders(now)).toBe(4);
    expect(await reminders()).toEqual(
      [
        `Count 21 days after planting → ${owner.email}`,
        `Count 21 days after planting → ${technician.email}`,
        `Planned count → ${owner.email}`,
        `Planned count → ${technician.email}`,
      ].sort(),
    );
    const [dap] = await MailMessage.findAll({ where: { toAddress: technician.email, subject: { [Op.like]: "%21 days after planting%" } } });
    expect(dap.textBody).toContain(`is planned for tomorrow, ${tomorrow}`);
    expect(dap.textBody).toContain(`${process.env.APP_BASE_URL}/trials/${fixture.trial.id}/data/${afterPlanting.id}`);

    // Run again the same day (a second server, or a retried job): nothing new is sent.
    expect(await sendAssessmentDueReminders(now)).toBe(0);
    expect(await reminders()).toHaveLength(4);
  });

  it("a daily job that fails partway and runs again sends no one a second reminder", async () => {
    await planned.update({ plannedDate: "2031-07-02" });
    await fixture.trial.update({ plantingDate: "2031-06-11" });
    await afterPlanting.update({ timingDays: 21 });
    const day = new Date("2031-07-01T07:00:00Z");
    let runs = 0;
    const job: DailyJob = {
      name: `test-job-reminders-${Math.random().toString(36).slice(2, 8)}`,
      hourUtc: 6,
      run: async (when) => {
        runs += 1;
        await sendAssessmentDueReminders(when);
        if (runs === 1) throw new Error("the digest step failed after the reminders were queued");
      },
    };
    const quiet = vi.spyOn(console, "error").mockImplementation(() => {});
    try {
      expect(await runDueDailyJobs([job], day)).toEqual([]);
    } finally {
      quiet.mockRestore();
    }
    expect(await runDueDailyJobs([job], day)).toEqual([job.name]);
    expect(runs).toBe(2);
    const july = await MailMessage.findAll({ where: { kind: "notice:assessment-due", subject: { [Op.like]: `%${fixture.trial.title}%` }, textBody: { [Op.like]: "%2031-07-02%" } } });
    expect(july.map((row) => `${row.toAddress} ${row.subject.startsWith("Due tomorrow: Planned count") ? "planned" : "after planting"}`).sort()).toEqual(
      [`${owner.email} after planting`, `${owner.email} planned`, `${technician.email} after planting`, `${technician.email} planned`].sort(),
    );
    await testDatabase().query(`DELETE FROM job_runs WHERE name = :name`, { replacements: { name: job.name } });
  });

  it("a digest reader's reminder is held once, not once per run", async () => {
    await saveNotificationPreferences(technician.id, { delivery: "digest", muted: [] });
    const day = new Date("2031-08-01T06:30:00Z");
    await planned.update({ plannedDate: "2031-08-02" });
    expect(await sendAssessmentDueReminders(day)).toBe(2);
    expect(await sendAssessmentDueReminders(day)).toBe(0);
    const held = await NotificationDigestItem.findAll({ where: { userId: technician.id, type: "assessment-due" } });
    expect(held.map((item) => item.summary)).toEqual([`“Planned count” in ${fixture.trial.title} is due on 2031-08-02.`]);
  });
});
