import { z } from "zod";
import { clientAddressFrom } from "@/lib/auth/client-address";
import { publicRoute } from "@/lib/auth/guard";
import { assertRegistrationAllowed } from "@/lib/auth/registration-throttle";
import { createUser } from "@/lib/data/users";
import { jsonResponse } from "@/lib/http";
import { registerSchema } from "@/lib/validations/auth";

const registeredSchema = z.object({ id: z.string(), email: z.string(), role: z.literal("grower") });

/**
 * Self-registration makes grower accounts only; other roles are created by an admin. The
 * limit comes before the account check, so a refused attempt learns nothing about the address.
 */
export const POST = publicRoute({ why: "people sign up before they have a session", body: registerSchema }, async ({ request, body }) => {
  await assertRegistrationAllowed(clientAddressFrom(request.headers.get("x-forwarded-for")));
  const user = await createUser({ name: body.name, email: body.email, password: body.password, role: "grower" });
  return jsonResponse(registeredSchema, { id: user.id, email: user.email, role: "grower" }, 201);
});
