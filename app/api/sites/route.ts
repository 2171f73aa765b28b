import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { db } from "@/lib/db/sequelize";
import { listSites, siteRecordSchema, toSiteRecord } from "@/lib/data/sites";
import { jsonResponse } from "@/lib/http";
import { Site } from "@/models";
import { siteSchema } from "@/lib/validations/trial";

export const dynamic = "force-dynamic";

export const GET = route({ permission: "trial:list" }, async () =>
  jsonResponse(z.object({ sites: z.array(siteRecordSchema) }), { sites: await listSites() }),
);

export const POST = route({ permission: "site:manage", body: siteSchema }, async ({ user, body }) => {
  db();
  const site = await Site.create({ ...body, latitude: null, longitude: null, createdById: user.id });
  return jsonResponse(siteRecordSchema, toSiteRecord(site), 201);
});
