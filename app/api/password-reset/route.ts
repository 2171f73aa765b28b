import { z } from "zod";
import { clientAddressFrom } from "@/lib/auth/client-address";
import { publicRoute } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { requestPasswordReset, resetRequestAnswer } from "@/lib/password-reset/service";
import { requestPasswordResetSchema } from "@/lib/validations/password-reset";

export const dynamic = "force-dynamic";

const answerSchema = z.object({ message: z.string() });

/** Same answer, in about the same time, whether or not the address has an account. */
export const POST = publicRoute(
  { why: "people who forgot their password cannot sign in", body: requestPasswordResetSchema },
  async ({ request, body }) => {
    await requestPasswordReset(body.email, clientAddressFrom(request.headers.get("x-forwarded-for")));
    return jsonResponse(answerSchema, { message: resetRequestAnswer }, 202);
  },
);
