import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { savePlotEntry } from "@/lib/observations/save-plot-entry";
import { committedVersionSchema } from "@/lib/uploads/schemas";
import { plotEntrySchema } from "@/lib/validations/observations";

/** Values keyed for one plot on a phone; replaces that plot's values in a new version. */
export const POST = route({ permission: "observation:write", body: plotEntrySchema, trialId: ({ body }) => body.trialId }, async ({ user, body, trial }) =>
  jsonResponse(committedVersionSchema, await savePlotEntry(user, trial!, body), 201),
);
