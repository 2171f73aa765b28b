import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { plotRecordSchema, plotsOf } from "@/lib/data/plots";
import { jsonResponse } from "@/lib/http";
import { trialIdParams } from "@/lib/validations/common";

export const dynamic = "force-dynamic";

export const GET = route({ permission: "trial:read", params: trialIdParams, trialId: ({ params }) => params.trialId }, async ({ trial }) =>
  jsonResponse(z.object({ seed: z.number(), plots: z.array(plotRecordSchema) }), { seed: trial!.randomSeed, plots: await plotsOf(trial!.id) }),
);
