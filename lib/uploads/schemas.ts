import { z } from "zod";

export const startedUploadSchema = z.object({ uploadId: z.string(), putUrl: z.string(), contentType: z.string() });

const problemSchema = z.object({
  severity: z.enum(["error", "warning"]),
  code: z.string(),
  row: z.number().optional(),
  column: z.string().optional(),
  message: z.string(),
});

export const checkedUploadSchema = z.object({
  uploadId: z.string(),
  status: z.enum(["checked", "refused"]),
  format: z.enum(["long", "wide"]).nullable(),
  rowCount: z.number(),
  sha256: z.string(),
  problems: z.array(problemSchema),
  errors: z.number(),
  warnings: z.number(),
  preview: z.array(z.object({ row: z.number(), plotNumber: z.number(), quadrat: z.number(), species: z.string(), value: z.number() })),
  changes: z.object({ added: z.number(), changed: z.number(), unchanged: z.number(), removed: z.number() }),
});
export type CheckedUploadBody = z.infer<typeof checkedUploadSchema>;

export const committedVersionSchema = z.object({ id: z.string(), number: z.number(), rowsAdded: z.number(), rowsReplaced: z.number() });
