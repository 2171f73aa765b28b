import { z } from "zod";
import { libraryMethods } from "./library";

/** Crops are matched in lower case; methods are their category names. */
export const followSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("crop"), value: z.string().trim().min(1, "Name the crop.").max(80, "Use at most 80 characters.").transform((value) => value.toLowerCase()) }),
  z.object({ kind: z.literal("method"), value: z.enum(libraryMethods, "Choose a method from the list.") }),
]);
export type FollowInput = z.output<typeof followSchema>;

export const followRecordSchema = z.object({ id: z.string(), kind: z.enum(["crop", "method"]), value: z.string(), createdAt: z.date() });
export const followListSchema = z.object({ follows: z.array(followRecordSchema) });
export const followIdParams = z.object({ followId: z.uuid("That id is not valid.") }).strict();
