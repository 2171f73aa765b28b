import { z } from "zod";
import { uuidSchema } from "./common";

export const plotEntrySchema = z
  .object({
    trialId: uuidSchema,
    assessmentId: uuidSchema,
    plotNumber: z.number().int().min(1).max(999_999),
    values: z
      .array(
        z
          .object({
            quadrat: z.number().int().min(1).max(50),
            species: z.string().trim().max(80).default(""),
            value: z.number().finite("Enter a number.").min(0, "Counts, weights and ratings cannot be negative.").nullable(),
          })
          .strict(),
      )
      .min(1, "Enter at least one value.")
      .max(2000),
    reason: z.string().trim().max(2000).optional(),
  })
  .strict();

export type PlotEntryInput = z.infer<typeof plotEntrySchema>;
