import { z } from "zod";
import { uuidSchema } from "./common";

export const reviewTrialParams = z.object({ trialId: uuidSchema }).strict();
export const reviewCommentParams = z.object({ trialId: uuidSchema, commentId: uuidSchema }).strict();

export const reviewRequestSchema = z.object({ message: z.string().trim().max(2000, "Keep the message under 2000 characters.").default("") }).strict();

export const commentSchema = z
  .object({
    body: z.string().trim().min(1, "Write a comment first.").max(4000, "Keep a comment under 4000 characters."),
    assessmentId: uuidSchema.nullable().default(null),
    parentId: uuidSchema.nullable().default(null),
  })
  .strict();

export const resolveSchema = z.object({ resolved: z.boolean() }).strict();

export const approveSchema = z.object({ note: z.string().trim().max(2000, "Keep the note under 2000 characters.").default("") }).strict();

export const reviewRequestResponse = z.object({ id: z.string(), status: z.string(), createdAt: z.coerce.date() });
export const commentResponse = z.object({ id: z.string(), assessmentId: z.string().nullable(), parentId: z.string().nullable(), body: z.string(), resolvedAt: z.coerce.date().nullable() });
export const approveResponse = z.object({ id: z.string(), status: z.literal("approved"), trialStatus: z.literal("locked") });
