import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { trialSummarySchema, trialsForHome } from "@/lib/data/trials";
import { jsonResponse } from "@/lib/http";

export const dynamic = "force-dynamic";

export const GET = route({ permission: "trial:list" }, async ({ user }) =>
  jsonResponse(z.object({ trials: z.array(trialSummarySchema) }), { trials: await trialsForHome(user) }),
);
