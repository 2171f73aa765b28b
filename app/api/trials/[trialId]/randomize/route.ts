import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { assertRandomizable } from "@/lib/trials/guard";
import { rerandomize } from "@/lib/trials/plan";
import { trialIdParams } from "@/lib/validations/common";
import { randomizeSchema } from "@/lib/validations/trial";

export const dynamic = "force-dynamic";

/** `{ newSeed: true }` draws and stores a new seed first; without it the stored seed is laid out again. */
export const POST = route(
  { permission: "trial:randomize", params: trialIdParams, body: randomizeSchema, trialId: ({ params }) => params.trialId },
  async ({ trial, body }) => {
    await assertRandomizable(trial!);
    return jsonResponse(z.object({ seed: z.number(), plots: z.number() }), await rerandomize(trial!, body));
  },
);
