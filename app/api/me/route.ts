import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { roles } from "@/lib/auth/roles";

export const dynamic = "force-dynamic";

const meSchema = z.object({ id: z.string(), email: z.string(), name: z.string(), role: z.enum(roles) });

export const GET = route({ permission: "published:read" }, async ({ user }) => jsonResponse(meSchema, user));
