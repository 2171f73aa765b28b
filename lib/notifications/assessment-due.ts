import "server-only";
import { Op } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { dayKey } from "@/lib/jobs/daily";
import { Assessment, Trial } from "@/models";
import { deliverNotice } from "./deliver";
import { notices } from "./messages";
import { activeUsers, teamIds } from "./recipients";

/**
 * The daily reminder: every assessment of an active trial planned for tomorrow (UTC) goes to
 * the trial's technicians and its owner. Returns how many notices were delivered or held.
 */
export async function sendAssessmentDueReminders(now = new Date()): Promise<number> {
  db();
  const tomorrow = dayKey(new Date(now.getTime() + 24 * 60 * 60 * 1000));
  const assessments = await Assessment.findAll({ where: { plannedDate: tomorrow }, include: [{ model: Trial, as: "trial", where: { status: { [Op.in]: ["active"] } } }] });
  let count = 0;
  for (const assessment of assessments) {
    const trial = (assessment as Assessment & { trial: Trial }).trial;
    const recipients = await activeUsers([trial.ownerId, ...(await teamIds(trial.id, ["technician"]))]);
    const notice = notices.assessmentDue({ trialId: trial.id, trialTitle: trial.title, assessmentId: assessment.id, assessmentName: assessment.name, plannedDate: tomorrow });
    for (const recipient of recipients) {
      const outcome = await deliverNotice(recipient, "assessment-due", notice);
      if (outcome !== "muted") count += 1;
    }
  }
  return count;
}
