import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { trialStatuses } from "@/models/Trial";
import { changeStatus } from "@/lib/trials/readiness";
import { trialIdParams } from "@/lib/validations/common";
import { statusChangeSchema } from "@/lib/validations/trial";

export const dynamic = "force-dynamic";

export const POST = route(
  { permission: "trial:change-status", params: trialIdParams, body: statusChangeSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, body }) =>
    jsonResponse(z.object({ status: z.enum(trialStatuses), warnings: z.array(z.string()) }), await changeStatus(trial!, body.status)),
);
