import { route } from "@/lib/auth/guard";
import { photoFile, photoTrialId } from "@/lib/photos/service";
import { photoFileParams } from "@/lib/validations/photos";

/** Photos are served through the app, so storage never needs to be public. */
export const GET = route(
  { permission: "trial:read", params: photoFileParams, trialId: ({ params }) => photoTrialId(params.photoId) },
  async ({ params }) => {
    const file = await photoFile(params.photoId, params.size);
    const stream = new ReadableStream<Uint8Array>({
      async start(controller) {
        for await (const chunk of file.body) controller.enqueue(chunk);
        controller.close();
      },
    });
    return new Response(stream, { headers: { "content-type": file.contentType, "cache-control": "private, max-age=3600", "x-content-type-options": "nosniff" } });
  },
);
