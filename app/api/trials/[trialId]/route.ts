import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { siteRecordSchema } from "@/lib/data/sites";
import { toTrialRecord, trialOverview, trialRecordSchema } from "@/lib/data/trials";
import { jsonResponse } from "@/lib/http";
import { saveBasics } from "@/lib/trials/plan";
import { trialIdParams } from "@/lib/validations/common";
import { trialBasicsSchema } from "@/lib/validations/trial";

export const dynamic = "force-dynamic";

const overviewSchema = z.object({ trial: trialRecordSchema, site: siteRecordSchema, ownerName: z.string() });

export const GET = route({ permission: "trial:read", params: trialIdParams, trialId: ({ params }) => params.trialId }, async ({ trial }) =>
  jsonResponse(overviewSchema, await trialOverview(trial!)),
);

export const PATCH = route(
  { permission: "trial:edit", params: trialIdParams, body: trialBasicsSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, body }) => jsonResponse(trialRecordSchema, toTrialRecord(await saveBasics(trial!, body))),
);
