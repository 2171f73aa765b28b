import "server-only";
import { Op, type WhereOptions } from "sequelize";
import { z } from "zod";
import type { SessionUser } from "@/lib/auth/session";
import { db } from "@/lib/db/sequelize";
import { Membership, Site, Trial } from "@/models";
import { trialDesigns, trialStatuses } from "@/models/Trial";

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
