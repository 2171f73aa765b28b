import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { committedVersionSchema } from "@/lib/uploads/schemas";
import { commitUpload, uploadTrialId } from "@/lib/uploads/service";
import { commitUploadSchema, uploadIdParams } from "@/lib/validations/uploads";

/** Step 3: the confirmed file becomes the assessment's next version, all rows or none. */
export const POST = route(
  { permission: "upload:create", params: uploadIdParams, body: commitUploadSchema, trialId: ({ params }) => uploadTrialId(params.uploadId) },
  async ({ user, params, body }) => jsonResponse(committedVersionSchema, await commitUpload(user, params.uploadId, body.reason), 201),
);
