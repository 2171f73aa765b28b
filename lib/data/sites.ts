import "server-only";
import { z } from "zod";
import { db } from "@/lib/db/sequelize";
import { Site } from "@/models";

export const siteRecordSchema = z.object({
  id: z.string(),
  name: z.string(),
  location: z.string(),
  region: z.string(),
  soil: z.string(),
  notes: z.string(),
});
export type SiteRecord = z.infer<typeof siteRecordSchema>;

export function toSiteRecord(site: Site): SiteRecord {
  return siteRecordSchema.parse(site.get({ plain: true }));
}

export async function listSites(): Promise<SiteRecord[]> {
  db();
  const sites = await Site.findAll({ order: [["name", "ASC"]] });
  return sites.map(toSiteRecord);
}

export async function findSite(id: string): Promise<SiteRecord | null> {
  db();
  const site = await Site.findByPk(id);
  return site ? toSiteRecord(site) : null;
}
