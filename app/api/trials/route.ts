import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { listTrials, toTrialRecord, trialRecordSchema, trialSummarySchema } from "@/lib/data/trials";
import { jsonResponse } from "@/lib/http";
import { createTrial } from "@/lib/trials/plan";
import { trialBasicsSchema, trialListQuerySchema } from "@/lib/validations/trial";

export const dynamic = "force-dynamic";

export const GET = route({ permission: "trial:list", query: trialListQuerySchema }, async ({ user, query }) =>
  jsonResponse(z.object({ trials: z.array(trialSummarySchema) }), { trials: await listTrials(user, query) }),
);

export const POST = route({ permission: "trial:create", body: trialBasicsSchema }, async ({ user, body }) =>
  jsonResponse(trialRecordSchema, toTrialRecord(await createTrial(user.id, body)), 201),
);
