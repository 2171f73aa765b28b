import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { createUser, listUsers, publicUserSchema } from "@/lib/data/users";
import { jsonResponse } from "@/lib/http";
import { createUserSchema } from "@/lib/validations/auth";

export const dynamic = "force-dynamic";

export const GET = route({ permission: "user:manage" }, async () =>
  jsonResponse(z.object({ users: z.array(publicUserSchema) }), { users: await listUsers() }),
);

export const POST = route({ permission: "user:manage", body: createUserSchema }, async ({ body }) =>
  jsonResponse(publicUserSchema, await createUser(body), 201),
);
