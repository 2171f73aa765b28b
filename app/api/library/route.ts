import { z } from "zod";
import { publicRoute } from "@/lib/auth/guard";
import { publishedTrials } from "@/lib/data/library";
import { jsonResponse } from "@/lib/http";
import { libraryEntrySchema, libraryQuerySchema } from "@/lib/validations/library";

export const dynamic = "force-dynamic";

export const GET = publicRoute(
  { why: "The library of published trials is for everyone, signed in or not; it lists published trials only.", query: libraryQuerySchema },
  async ({ query }) => jsonResponse(z.object({ trials: z.array(libraryEntrySchema) }), { trials: await publishedTrials(query) }),
);
