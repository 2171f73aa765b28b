import { z } from "zod";

export const SUMMARY_MAX_CHARS = 20_000;

/** The researcher's edit; null goes back to the generated text. */
export const summaryEditSchema = z
  .object({
    text: z.string().trim().min(1, "The summary cannot be empty; reset it to the generated text instead.").max(SUMMARY_MAX_CHARS, `Keep the summary under ${SUMMARY_MAX_CHARS} characters.`).nullable(),
    /** The generated text the edit was made against, as the editor showed it (see saveSummaryEdit). */
    basedOn: z.string().max(SUMMARY_MAX_CHARS * 2).optional(),
  })
  .strict();

export const summaryStateSchema = z.object({
  trialId: z.string(),
  status: z.string(),
  text: z.string(),
  generatedText: z.string(),
  edited: z.boolean(),
  generatedChangedSinceEdit: z.boolean(),
  publishedAt: z.date().nullable(),
});
