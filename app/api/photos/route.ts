import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { startPhoto } from "@/lib/photos/service";
import { startPhotoSchema } from "@/lib/validations/photos";

const startedSchema = z.object({ photoId: z.string(), putUrl: z.string(), thumbnailPutUrl: z.string() });

/** Registers a plot photo and its thumbnail; the browser sends both straight to storage. */
export const POST = route({ permission: "observation:write", body: startPhotoSchema, trialId: ({ body }) => body.trialId }, async ({ user, body, trial }) =>
  jsonResponse(startedSchema, await startPhoto(user, trial!, body), 201),
);
