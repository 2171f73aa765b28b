import "server-only";
import { Op, QueryTypes, type WhereOptions } from "sequelize";
import { z } from "zod";
import type { SessionUser } from "@/lib/auth/session";
import { db } from "@/lib/db/sequelize";
import { Membership, Site, Treatment, Trial, User } from "@/models";
import { membershipRoles } from "@/models/Membership";
import { trialDesigns, trialStatuses, type TrialStatus } from "@/models/Trial";
import { toSiteRecord, type SiteRecord } from "./sites";

export const trialSummarySchema = z.object({
  id: z.string(),
  title: z.string(),
  crop: z.string(),
  season: z.string(),
  design: z.enum(trialDesigns),
  blocks: z.number(),
  status: z.enum(trialStatuses),
  siteName: z.string(),
  region: z.string(),
  updatedAt: z.date(),
});
export type TrialSummary = z.infer<typeof trialSummarySchema>;

async function summaries(where: WhereOptions<Trial>): Promise<TrialSummary[]> {
  db();
  const trials = await Trial.findAll({
    where,
    include: [{ model: Site, as: "site", attributes: ["name", "region"] }],
    order: [["season", "DESC"], ["title", "ASC"]],
  });
  return trials.map((trial) => {
    const site = (trial as Trial & { site: Site }).site;
    return trialSummarySchema.parse({ ...trial.get({ plain: true }), siteName: site.name, region: site.region });
  });
}

async function memberTrialIds(userId: string, role: "technician" | "reviewer"): Promise<string[]> {
  db();
  const memberships = await Membership.findAll({ where: { userId, role }, attributes: ["trialId"] });
  return memberships.map((membership) => membership.trialId);
}

/** The trials a home page lists: what each role works on. */
export async function trialsForHome(user: SessionUser): Promise<TrialSummary[]> {
  switch (user.role) {
    case "admin":
      return summaries({});
    case "researcher":
      return summaries({ ownerId: user.id });
    case "technician":
      return summaries({ id: { [Op.in]: await memberTrialIds(user.id, "technician") }, status: { [Op.in]: ["draft", "active"] } });
    case "reviewer":
      return summaries({ id: { [Op.in]: await memberTrialIds(user.id, "reviewer") } });
    case "grower":
      return summaries({ status: "published" });
  }
}

/** Which trials a user may see at all, the same rule as lib/auth/trial-access.ts. */
async function visibleWhere(user: SessionUser): Promise<WhereOptions<Trial>> {
  switch (user.role) {
    case "admin":
      return {};
    case "researcher":
      return { ownerId: user.id };
    case "technician":
    case "reviewer":
      return { id: { [Op.in]: await memberTrialIds(user.id, user.role) } };
    case "grower":
      return { id: { [Op.in]: [] } };
  }
}

/** The trial list with its filters; every filter narrows what the user may already see. */
export async function listTrials(user: SessionUser, filters: { crop?: string; season?: string; status?: TrialStatus | null }): Promise<TrialSummary[]> {
  const where: Record<string, unknown> = { ...(await visibleWhere(user)) };
  if (filters.crop) where.crop = { [Op.iLike]: filters.crop };
  if (filters.season) where.season = filters.season;
  if (filters.status) where.status = filters.status;
  return summaries(where as WhereOptions<Trial>);
}

/** Crops and seasons among the user's trials, for the filter menus. */
export async function trialFilterChoices(user: SessionUser): Promise<{ crops: string[]; seasons: string[] }> {
  const trials = await listTrials(user, {});
  const crops = [...new Set(trials.map((trial) => trial.crop))].sort((a, b) => a.localeCompare(b));
  const seasons = [...new Set(trials.map((trial) => trial.season))].sort((a, b) => b.localeCompare(a));
  return { crops, seasons };
}

export const trialRecordSchema = z.object({
  id: z.string(),
  title: z.string(),
  crop: z.string(),
  season: z.string(),
  siteId: z.string(),
  objective: z.string(),
  design: z.enum(trialDesigns),
  blocks: z.number(),
  plotLengthM: z.number(),
  plotWidthM: z.number(),
  harvestAreaM2: z.number(),
  quadratAreaM2: z.number(),
  plantingDate: z.string().nullable(),
  randomSeed: z.number(),
  serpentine: z.boolean(),
  status: z.enum(trialStatuses),
  ownerId: z.string(),
  updatedAt: z.date(),
});
export type TrialRecord = z.infer<typeof trialRecordSchema>;

export function toTrialRecord(trial: Trial): TrialRecord {
  return trialRecordSchema.parse(trial.get({ plain: true }));
}

export interface TrialOverview {
  trial: TrialRecord;
  site: SiteRecord;
  ownerName: string;
}

export async function trialOverview(trial: Trial): Promise<TrialOverview> {
  db();
  const [site, owner] = await Promise.all([Site.findByPk(trial.siteId), User.findByPk(trial.ownerId, { attributes: ["name"] })]);
  return { trial: toTrialRecord(trial), site: toSiteRecord(site!), ownerName: owner?.name ?? "" };
}

export const teamMemberSchema = z.object({
  userId: z.string(),
  name: z.string(),
  email: z.string(),
  role: z.enum(membershipRoles),
});
export type TeamMember = z.infer<typeof teamMemberSchema>;

export async function teamOf(trialId: string): Promise<TeamMember[]> {
  // A plain join: the trial page asks on every view, and the ORM's include was the costlier path.
  const members = await db().query<TeamMember>(
    `SELECT m.user_id AS "userId", m.role, u.name, u.email FROM memberships m JOIN users u ON u.id = m.user_id WHERE m.trial_id = :trialId`,
    { replacements: { trialId }, type: QueryTypes.SELECT },
  );
  return members.map((member) => teamMemberSchema.parse(member)).sort((a, b) => a.role.localeCompare(b.role) || a.name.localeCompare(b.name));
}

/** People who can join a team: active technicians and reviewers. */
export async function teamCandidates(): Promise<TeamMember[]> {
  db();
  const users = await User.findAll({ where: { role: { [Op.in]: [...membershipRoles] }, active: true }, order: [["name", "ASC"]] });
  return users.map((user) => teamMemberSchema.parse({ userId: user.id, name: user.name, email: user.email, role: user.role }));
}

/** Other trials of the user that have treatments to copy from. */
export async function trialsToCopyFrom(user: SessionUser, exceptTrialId: string): Promise<{ id: string; title: string; season: string; treatments: number }[]> {
  const where = await visibleWhere(user);
  db();
  const trials = await Trial.findAll({ where, attributes: ["id", "title", "season"], order: [["season", "DESC"], ["title", "ASC"]] });
  const counts = await Treatment.count({ where: { trialId: trials.map((trial) => trial.id) }, group: ["trialId"] });
  const byTrial = new Map(counts.map((row) => [String((row as { trialId?: string; trial_id?: string }).trialId ?? (row as { trial_id?: string }).trial_id), Number(row.count)]));
  return trials
    .filter((trial) => trial.id !== exceptTrialId && (byTrial.get(trial.id) ?? 0) > 0)
    .map((trial) => ({ id: trial.id, title: trial.title, season: trial.season, treatments: byTrial.get(trial.id) ?? 0 }));
}
