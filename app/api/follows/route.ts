import { route } from "@/lib/auth/guard";
import { addFollow, followsOf } from "@/lib/data/follows";
import { jsonResponse } from "@/lib/http";
import { followListSchema, followRecordSchema, followSchema } from "@/lib/validations/follows";

export const dynamic = "force-dynamic";

export const GET = route({ permission: "follow:manage" }, async ({ user }) =>
  jsonResponse(followListSchema, { follows: (await followsOf(user.id)).map((follow) => follow.get({ plain: true })) }),
);

export const POST = route({ permission: "follow:manage", body: followSchema }, async ({ user, body }) =>
  jsonResponse(followRecordSchema, (await addFollow(user.id, body)).get({ plain: true }), 201),
);
