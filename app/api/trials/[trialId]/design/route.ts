import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { plotCount } from "@/lib/data/plots";
import { toTrialRecord, trialRecordSchema } from "@/lib/data/trials";
import { jsonResponse } from "@/lib/http";
import { saveDesign } from "@/lib/trials/plan";
import { trialIdParams } from "@/lib/validations/common";
import { trialDesignSchema } from "@/lib/validations/trial";

export const dynamic = "force-dynamic";

export const PUT = route(
  { permission: "trial:edit", params: trialIdParams, body: trialDesignSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, body }) => {
    await saveDesign(trial!, body);
    await trial!.reload();
    return jsonResponse(z.object({ trial: trialRecordSchema, plots: z.number() }), { trial: toTrialRecord(trial!), plots: await plotCount(trial!.id) });
  },
);
