import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { assessmentRecordSchema, assessmentsOf } from "@/lib/data/assessments";
import { jsonResponse } from "@/lib/http";
import { saveAssessments } from "@/lib/trials/plan";
import { trialIdParams } from "@/lib/validations/common";
import { trialAssessmentsSchema } from "@/lib/validations/trial";

export const dynamic = "force-dynamic";

const listSchema = z.object({ assessments: z.array(assessmentRecordSchema) });

export const GET = route({ permission: "trial:read", params: trialIdParams, trialId: ({ params }) => params.trialId }, async ({ trial }) =>
  jsonResponse(listSchema, { assessments: await assessmentsOf(trial!.id) }),
);

export const PUT = route(
  { permission: "trial:edit", params: trialIdParams, body: trialAssessmentsSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, body }) => {
    await saveAssessments(trial!, body);
    return jsonResponse(listSchema, { assessments: await assessmentsOf(trial!.id) });
  },
);
