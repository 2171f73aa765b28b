import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { treatmentRecordSchema, treatmentsOf } from "@/lib/data/treatments";
import { jsonResponse } from "@/lib/http";
import { saveTreatments } from "@/lib/trials/plan";
import { trialIdParams } from "@/lib/validations/common";
import { trialTreatmentsSchema } from "@/lib/validations/trial";

export const dynamic = "force-dynamic";

const listSchema = z.object({ treatments: z.array(treatmentRecordSchema) });

/** Also what "copy from another trial" reads, so copying needs only read access to the source. */
export const GET = route({ permission: "trial:read", params: trialIdParams, trialId: ({ params }) => params.trialId }, async ({ trial }) =>
  jsonResponse(listSchema, { treatments: await treatmentsOf(trial!.id) }),
);

export const PUT = route(
  { permission: "trial:edit", params: trialIdParams, body: trialTreatmentsSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, body }) => {
    await saveTreatments(trial!, body);
    return jsonResponse(listSchema, { treatments: await treatmentsOf(trial!.id) });
  },
);
