import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { teamMemberSchema, teamOf } from "@/lib/data/trials";
import { jsonResponse } from "@/lib/http";
import { saveTeam } from "@/lib/trials/plan";
import { trialIdParams } from "@/lib/validations/common";
import { trialTeamSchema } from "@/lib/validations/trial";

export const dynamic = "force-dynamic";

const teamSchema = z.object({ members: z.array(teamMemberSchema) });

export const GET = route({ permission: "trial:read", params: trialIdParams, trialId: ({ params }) => params.trialId }, async ({ trial }) =>
  jsonResponse(teamSchema, { members: await teamOf(trial!.id) }),
);

export const PUT = route(
  { permission: "trial:manage-team", params: trialIdParams, body: trialTeamSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, body }) => {
    await saveTeam(trial!, body);
    return jsonResponse(teamSchema, { members: await teamOf(trial!.id) });
  },
);
