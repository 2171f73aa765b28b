import { z } from "zod";
import { publicRoute } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { resetPassword } from "@/lib/password-reset/service";
import { confirmPasswordResetSchema } from "@/lib/validations/password-reset";

export const dynamic = "force-dynamic";

const doneSchema = z.object({ email: z.string() });

export const POST = publicRoute(
  { why: "the single-use token from the reset mail stands in for the forgotten password", body: confirmPasswordResetSchema },
  async ({ body }) => jsonResponse(doneSchema, await resetPassword(body.token, body.password)),
);
