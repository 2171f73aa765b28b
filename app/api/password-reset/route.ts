import type { NextRequest } from "next/server";
import { z } from "zod";
import { publicRoute } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { requestPasswordReset, resetRequestAnswer } from "@/lib/password-reset/service";
import { requestPasswordResetSchema } from "@/lib/validations/password-reset";

export const dynamic = "force-dynamic";

/**
 * The client as the nearest proxy saw it: the last X-Forwarded-For hop (a load balancer
 * appends it; Next sets it from the socket when there is none).
 */
function clientAddress(request: NextRequest): string {
  const hops = (request.headers.get("x-forwarded-for") ?? "").split(",").map((hop) => hop.trim()).filter(Boolean);
  return hops.at(-1) ?? request.headers.get("x-real-ip") ?? "unknown";
}

const answerSchema = z.object({ message: z.string() });

/** Same answer, in about the same time, whether or not the address has an account. */
export const POST = publicRoute(
  { why: "people who forgot their password cannot sign in", body: requestPasswordResetSchema },
  async ({ request, body }) => {
    await requestPasswordReset(body.email, clientAddress(request));
    return jsonResponse(answerSchema, { message: resetRequestAnswer }, 202);
  },
);
