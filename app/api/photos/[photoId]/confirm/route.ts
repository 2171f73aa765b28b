import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { confirmPhoto, photoTrialId } from "@/lib/photos/service";
import { photoIdParams } from "@/lib/validations/photos";

export const POST = route(
  { permission: "observation:write", params: photoIdParams, trialId: ({ params }) => photoTrialId(params.photoId) },
  async ({ params }) => jsonResponse(z.object({ photoId: z.string() }), await confirmPhoto(params.photoId)),
);
