import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { startedUploadSchema } from "@/lib/uploads/schemas";
import { startUpload } from "@/lib/uploads/service";
import { startUploadSchema } from "@/lib/validations/uploads";

/** Step 1 of an upload: register the file and get a presigned PUT to object storage. */
export const POST = route({ permission: "upload:create", body: startUploadSchema, trialId: ({ body }) => body.trialId }, async ({ user, body, trial }) =>
  jsonResponse(startedUploadSchema, await startUpload(user, trial!, body), 201),
);
