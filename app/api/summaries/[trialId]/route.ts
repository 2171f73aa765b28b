import { route } from "@/lib/auth/guard";
import { summaryOf } from "@/lib/data/summaries";
import { jsonResponse } from "@/lib/http";
import { saveSummaryEdit } from "@/lib/summaries/publish";
import { trialIdParams } from "@/lib/validations/common";
import { summaryEditSchema, summaryStateSchema } from "@/lib/validations/summaries";
import type { Trial } from "@/models";

export const dynamic = "force-dynamic";

async function state(trial: Trial) {
  const view = await summaryOf(trial);
  return { trialId: trial.id, status: trial.status, text: view.text, generatedText: view.generated.text, edited: view.edited, generatedChangedSinceEdit: view.generatedChangedSinceEdit, publishedAt: view.published?.at ?? null };
}

export const GET = route({ permission: "summary:edit", params: trialIdParams, trialId: ({ params }) => params.trialId }, async ({ trial }) =>
  jsonResponse(summaryStateSchema, await state(trial!)),
);

/** Saves the researcher's edit of the generated text (and the generated text it was made against); { text: null } goes back to the generated text. */
export const PUT = route(
  { permission: "summary:edit", params: trialIdParams, body: summaryEditSchema, trialId: ({ params }) => params.trialId },
  async ({ user, body, trial }) => {
    await saveSummaryEdit(user, trial!, body.text, body.basedOn);
    return jsonResponse(summaryStateSchema, await state(trial!));
  },
);
