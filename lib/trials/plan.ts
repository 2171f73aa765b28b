import "server-only";
import { Op, UniqueConstraintError, type Transaction } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { AppError } from "@/lib/errors";
import { Assessment, Membership, Plot, Site, Treatment, Trial, User } from "@/models";
import type { z } from "zod";
import type {
  trialAssessmentsSchema,
  trialBasicsSchema,
  trialDesignSchema,
  trialTeamSchema,
  trialTreatmentsSchema,
} from "@/lib/validations/trial";
import { applyLayout, clearLayout, layoutProblem, newSeed } from "./apply-layout";
import { assertEditable } from "./guard";
import { assessmentsWithObservations, hasObservations } from "./observations";
import { pinnedDetails, pinnedDetailsRefusal } from "./edit-rules";

/*
 * The writes behind each wizard step. Each step saves on its own, so a plan can be left half
 * done and resumed; the edit rules (lib/trials/edit-rules.ts) are checked before anything changes.
 */

async function requireSite(siteId: string): Promise<void> {
  if (!(await Site.findByPk(siteId))) throw new AppError("INVALID_INPUT", "Choose a site.", [{ path: "siteId", message: "That site does not exist." }]);
}

export async function createTrial(ownerId: string, basics: z.output<typeof trialBasicsSchema>): Promise<Trial> {
  db();
  await requireSite(basics.siteId);
  // Sensible starting values for the design step; the researcher sets them there.
  return Trial.create({
    ...basics,
    design: "rcbd",
    blocks: 4,
    plotLengthM: 6,
    plotWidthM: 1.5,
    harvestAreaM2: 4.5,
    quadratAreaM2: 0.25,
    randomSeed: newSeed(),
    serpentine: true,
    ownerId,
  });
}

export async function saveBasics(trial: Trial, basics: z.output<typeof trialBasicsSchema>): Promise<Trial> {
  await assertEditable(trial, "details");
  const changed = pinnedDetails.filter((detail) => (basics[detail] ?? null) !== (trial[detail] ?? null));
  const pinned = changed.length > 0 ? pinnedDetailsRefusal(changed, await hasObservations(trial.id)) : null;
  if (pinned) throw new AppError("CONFLICT", pinned);
  if (basics.siteId !== trial.siteId) {
    if (trial.status !== "draft") throw new AppError("CONFLICT", "This trial is in the field; its site can no longer change.");
    await requireSite(basics.siteId);
  }
  return trial.update(basics);
}

/** Re-lays the plots with the stored seed when the plan allows, so the layout always matches it. */
async function refreshLayout(trial: Trial, transaction: Transaction): Promise<void> {
  const count = await Treatment.count({ where: { trialId: trial.id }, transaction });
  if (layoutProblem(trial.design, trial.blocks, count)) await clearLayout(trial.id, transaction);
  else await applyLayout(trial, transaction);
}

export async function saveTreatments(trial: Trial, input: z.output<typeof trialTreatmentsSchema>): Promise<void> {
  await assertEditable(trial, "structure");
  const sequelize = db();
  await sequelize.transaction(async (transaction) => {
    const existing = await Treatment.findAll({ where: { trialId: trial.id }, transaction });
    const existingIds = new Set(existing.map((treatment) => treatment.id));
    const keptIds = new Set(input.treatments.flatMap((treatment) => (treatment.id && existingIds.has(treatment.id) ? [treatment.id] : [])));
    // Plots point at treatments; the layout is rebuilt below from the new list.
    await Plot.destroy({ where: { trialId: trial.id }, transaction });
    await Treatment.destroy({ where: { trialId: trial.id, id: { [Op.notIn]: [...keptIds] } }, transaction });
    // Codes are unique per trial: park kept rows on temporary codes before renumbering.
    for (const id of keptIds) await Treatment.update({ code: `~${id.slice(0, 7)}` }, { where: { id }, transaction });
    for (const [index, { id, ...values }] of input.treatments.entries()) {
      const fields = { ...values, position: index + 1 };
      if (id && keptIds.has(id)) await Treatment.update(fields, { where: { id, trialId: trial.id }, transaction });
      else await Treatment.create({ ...fields, trialId: trial.id }, { transaction });
    }
    if (trial.design === "latin") await trial.update({ blocks: input.treatments.length }, { transaction });
    await refreshLayout(trial, transaction);
  });
}

export async function saveDesign(trial: Trial, input: z.output<typeof trialDesignSchema>): Promise<void> {
  await assertEditable(trial, "structure");
  const sequelize = db();
  await sequelize.transaction(async (transaction) => {
    const treatments = await Treatment.count({ where: { trialId: trial.id }, transaction });
    const blocks = input.design === "latin" ? Math.max(treatments, 2) : input.blocks;
    if (input.design === "latin" && treatments < 3) {
      throw new AppError("INVALID_INPUT", "A Latin square needs at least three treatments.", [{ path: "design", message: "A Latin square needs at least three treatments." }]);
    }
    await trial.update({ ...input, blocks }, { transaction });
    await refreshLayout(trial, transaction);
  });
}

/** One click: a new stored seed and a new layout. Only a draft may be re-randomized. */
export async function rerandomize(trial: Trial, options: { newSeed: boolean }): Promise<{ seed: number; plots: number }> {
  const sequelize = db();
  return sequelize.transaction(async (transaction) => {
    if (options.newSeed) await trial.update({ randomSeed: newSeed() }, { transaction });
    const plots = await applyLayout(trial, transaction);
    return { seed: trial.randomSeed, plots };
  });
}

export async function saveAssessments(trial: Trial, input: z.output<typeof trialAssessmentsSchema>): Promise<void> {
  await assertEditable(trial, "assessment");
  const pinned = await assessmentsWithObservations(trial.id);
  const sequelize = db();
  await sequelize.transaction(async (transaction) => {
    const existing = await Assessment.findAll({ where: { trialId: trial.id }, transaction });
    const incomingIds = new Set(input.assessments.flatMap((assessment) => (assessment.id ? [assessment.id] : [])));
    for (const assessment of existing) {
      if (pinned.has(assessment.id) && !incomingIds.has(assessment.id)) {
        throw new AppError("CONFLICT", `Observations have been recorded for "${assessment.name}"; it cannot be deleted.`);
      }
    }
    const existingById = new Map(existing.map((assessment) => [assessment.id, assessment]));
    await Assessment.destroy({ where: { trialId: trial.id, id: { [Op.notIn]: [...incomingIds] } }, transaction });
    for (const [index, { id, ...values }] of input.assessments.entries()) {
      const fields = { ...values, position: index + 1 };
      const current = id ? existingById.get(id) : undefined;
      if (current) {
        if (pinned.has(current.id) && (current.variable !== values.variable || current.unit !== values.unit || current.quadratsPerPlot !== values.quadratsPerPlot)) {
          throw new AppError("CONFLICT", `Observations have been recorded for "${current.name}"; what it measures, its unit and quadrats can no longer change.`);
        }
        await current.update(fields, { transaction });
      } else {
        await Assessment.create({ ...fields, trialId: trial.id }, { transaction });
      }
    }
  });
}

export async function saveTeam(trial: Trial, input: z.output<typeof trialTeamSchema>): Promise<void> {
  await assertEditable(trial, "team");
  const sequelize = db();
  const users = await User.findAll({ where: { id: input.members.map((member) => member.userId) } });
  const byId = new Map(users.map((user) => [user.id, user]));
  const problems = input.members.flatMap((member, index) => {
    const user = byId.get(member.userId);
    if (!user || !user.active) return [{ path: `members.${index}.userId`, message: "That person has no active account." }];
    if (user.role !== member.role) return [{ path: `members.${index}.role`, message: `${user.name} is a ${user.role}, not a ${member.role}.` }];
    return [];
  });
  if (problems.length > 0) throw new AppError("INVALID_INPUT", "Some team members need attention.", problems);
  try {
    await sequelize.transaction(async (transaction) => {
      await Membership.destroy({ where: { trialId: trial.id }, transaction });
      for (const member of input.members) await Membership.create({ trialId: trial.id, userId: member.userId, role: member.role }, { transaction });
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new AppError("CONFLICT", "A person can be on the team only once.");
    throw error;
  }
}
