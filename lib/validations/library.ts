import { z } from "zod";
import { methodCategories } from "@/lib/trials/vocabulary";

/** Method categories a reader can look for (the checks are in every trial). */
export const libraryMethods = methodCategories.filter((category) => category !== "check");

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `Use at most ${max} characters.`)
    .optional()
    .transform((value) => (value ? value : undefined));

export const libraryQuerySchema = z.object({
  q: optionalText(100),
  crop: optionalText(80),
  method: z
    .union([z.enum(libraryMethods, "Choose a method from the list."), z.literal("")])
    .optional()
    .transform((value) => (value ? value : undefined)),
  region: optionalText(120),
  season: optionalText(20),
});
export type LibraryQuery = z.output<typeof libraryQuerySchema>;

export const libraryEntrySchema = z.object({
  id: z.string(),
  title: z.string(),
  crop: z.string(),
  season: z.string(),
  siteName: z.string(),
  region: z.string(),
  methods: z.array(z.object({ name: z.string(), category: z.string() })),
  publishedAt: z.date().nullable(),
});
export type LibraryEntry = z.infer<typeof libraryEntrySchema>;
