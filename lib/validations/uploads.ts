import { z } from "zod";
import { defaultIngestLimits } from "@/lib/ingest/types";
import { uuidSchema } from "./common";

const maxMegabytes = Math.round(defaultIngestLimits.maxBytes / 1024 / 1024);

export const startUploadSchema = z
  .object({
    trialId: uuidSchema,
    assessmentId: uuidSchema,
    fileName: z
      .string()
      .trim()
      .min(1, "The file has no name.")
      .max(200, "The file name is too long (200 characters at most).")
      .refine((name) => /\.(csv|txt)$/i.test(name), "Upload a .csv file (the data sheet saved as CSV)."),
    sizeBytes: z
      .number()
      .int()
      .min(1, "The file is empty. Fill in the data sheet and upload it again.")
      .max(defaultIngestLimits.maxBytes, `The file is larger than ${maxMegabytes} MB, the most one upload may be.`),
  })
  .strict();

export const uploadIdParams = z.object({ uploadId: uuidSchema }).strict();

export const commitUploadSchema = z
  .object({ reason: z.string().trim().max(2000, "Keep the reason under 2000 characters.").optional() })
  .strict();

export type StartUploadInput = z.infer<typeof startUploadSchema>;
