import { z } from "zod";
import { uuidSchema } from "./common";

export const photoTypes = ["image/jpeg", "image/png", "image/webp"] as const;
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;
export const MAX_THUMBNAIL_BYTES = 300 * 1024;

export const startPhotoSchema = z
  .object({
    trialId: uuidSchema,
    plotNumber: z.number().int().min(1).max(999_999),
    assessmentId: uuidSchema.nullable(),
    contentType: z.enum(photoTypes, "Photos must be JPEG, PNG or WebP images."),
    sizeBytes: z.number().int().min(1, "The photo is empty.").max(MAX_PHOTO_BYTES, "The photo is larger than 15 MB."),
    thumbnailBytes: z.number().int().min(1).max(MAX_THUMBNAIL_BYTES, "The thumbnail is too large."),
    caption: z.string().trim().max(300, "Keep the caption under 300 characters.").default(""),
  })
  .strict();

export const photoIdParams = z.object({ photoId: uuidSchema }).strict();
export const photoFileParams = z.object({ photoId: uuidSchema, size: z.enum(["thumbnail", "original"]) }).strict();

export type StartPhotoInput = z.infer<typeof startPhotoSchema>;
