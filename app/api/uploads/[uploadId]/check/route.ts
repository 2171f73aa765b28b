import { route } from "@/lib/auth/guard";
import { jsonResponse } from "@/lib/http";
import { checkedUploadSchema } from "@/lib/uploads/schemas";
import { checkUpload, uploadTrialId } from "@/lib/uploads/service";
import { uploadIdParams } from "@/lib/validations/uploads";

/** Step 2: the server reads the stored file back, checks every row and returns the preview. */
export const POST = route(
  { permission: "upload:create", params: uploadIdParams, trialId: ({ params }) => uploadTrialId(params.uploadId) },
  async ({ params }) => jsonResponse(checkedUploadSchema, await checkUpload(params.uploadId)),
);
