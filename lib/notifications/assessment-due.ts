import "server-only";
import { Op, QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { dayKey } from "@/lib/jobs/daily";
import { wakeMailWorker } from "@/lib/jobs/mail-worker";
import { dueDate } from "@/lib/trials/schedule";
import { Assessment, Trial } from "@/models";
import { deliverNotice, type DeliveryOutcome, type Recipient } from "./deliver";
import { notices } from "./messages";
import { activeUsers, teamIds } from "./recipients";

const DAY_MS = 24 * 60 * 60 * 1000;

type DueAssessment = Assessment & { trial: Trial };

/**
 * Assessments of active trials due on `day`, by the schedule's own rule (dueDate): a planned
 * date, or days after planting. The query only narrows the candidates; dueDate() decides, so
 * the reminder and the schedule page can never disagree.
 */
async function assessmentsDueOn(day: string): Promise<DueAssessment[]> {
  const candidates = (await Assessment.findAll({
    where: { [Op.or]: [{ plannedDate: day }, { plannedDate: null, timingReference: "planting", timingDays: { [Op.ne]: null } }] },
    include: [{ model: Trial, as: "trial", where: { status: "active" }, required: true }],
  })) as DueAssessment[];
  return candidates.filter((assessment) => dueDate(assessment, assessment.trial.plantingDate) === day);
}

/**
 * Claims the reminder (assessment, due day, person) and queues it in one transaction. A run
 * that failed partway and runs again finds the claim and sends nothing twice; a failure
 * before the commit leaves neither, so the rerun sends it.
 */
async function remindOnce(recipient: Recipient, assessment: DueAssessment, day: string): Promise<DeliveryOutcome | "already"> {
  const sequelize = db();
  return sequelize.transaction(async (transaction) => {
    const claimed = await sequelize.query(
      `INSERT INTO assessment_reminders (assessment_id, due_date, user_id, created_at) VALUES (:assessmentId, :day, :userId, now())
       ON CONFLICT DO NOTHING RETURNING user_id`,
      { type: QueryTypes.SELECT, replacements: { assessmentId: assessment.id, day, userId: recipient.id }, transaction },
    );
    if (claimed.length === 0) return "already";
    const notice = notices.assessmentDue({ trialId: assessment.trial.id, trialTitle: assessment.trial.title, assessmentId: assessment.id, assessmentName: assessment.name, plannedDate: day });
    return deliverNotice(recipient, "assessment-due", notice, { transaction });
  });
}

/**
 * The daily reminder: every assessment of an active trial due tomorrow (UTC) goes to the
 * trial's technicians and its owner, once per person. Returns how many notices were newly
 * delivered or held.
 */
export async function sendAssessmentDueReminders(now = new Date()): Promise<number> {
  db();
  const tomorrow = dayKey(new Date(now.getTime() + DAY_MS));
  let count = 0;
  let queued = false;
  for (const assessment of await assessmentsDueOn(tomorrow)) {
    const trial = assessment.trial;
    const recipients = await activeUsers([trial.ownerId, ...(await teamIds(trial.id, ["technician"]))]);
    for (const recipient of recipients) {
      const outcome = await remindOnce(recipient, assessment, tomorrow);
      if (outcome === "queued" || outcome === "digest") count += 1;
      if (outcome === "queued") queued = true;
    }
  }
  if (queued) wakeMailWorker();
  return count;
}
