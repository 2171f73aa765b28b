import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { removeFollow } from "@/lib/data/follows";
import { notFound } from "@/lib/errors";
import { jsonResponse } from "@/lib/http";
import { followIdParams } from "@/lib/validations/follows";

export const dynamic = "force-dynamic";

/** Stops following; someone else's follow is 404, like one that does not exist. */
export const DELETE = route({ permission: "follow:manage", params: followIdParams }, async ({ user, params }) => {
  if (!(await removeFollow(user.id, params.followId))) throw notFound("follow");
  return jsonResponse(z.object({ removed: z.literal(true) }), { removed: true });
});
