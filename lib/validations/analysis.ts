import { z } from "zod";
import { uuidSchema } from "./common";

export const transforms = ["none", "sqrt", "log1p", "asin-sqrt"] as const;
export const separationMethods = ["lsd", "tukey"] as const;
export type SeparationMethod = (typeof separationMethods)[number];

export const transformLabels: Record<(typeof transforms)[number], string> = {
  none: "None",
  sqrt: "Square root",
  log1p: "log(x + 1)",
  "asin-sqrt": "Arcsine square root",
};

const emptyToUndefined = (value: unknown) => (value === "" || value === null ? undefined : value);

/**
 * Options of an assessment's analysis, as the results page sends them in the query string.
 * The same schema fills in the defaults for the report and the cache key.
 */
export const analysisOptionsSchema = z
  .object({
    transform: z.enum(transforms, { error: "Choose none, square root, log(x + 1) or arcsine square root." }).default("none"),
    method: z.enum(separationMethods, { error: "Choose Fisher's protected LSD or Tukey HSD." }).default("lsd"),
    alpha: z.preprocess(emptyToUndefined, z.coerce.number().min(0.001, "Alpha must be between 0.001 and 0.2.").max(0.2, "Alpha must be between 0.001 and 0.2.").default(0.05)),
    control: z.preprocess(emptyToUndefined, z.string().trim().min(1).max(20).optional()),
    reference: z.preprocess(emptyToUndefined, z.string().trim().min(1).max(20).optional()),
    margin: z.preprocess(emptyToUndefined, z.coerce.number().positive("The margin must be above zero.").optional()),
  })
  .strict()
  .superRefine((options, context) => {
    if (options.reference !== undefined && options.margin === undefined) {
      context.addIssue({ code: "custom", path: ["margin"], message: "Give an equivalence margin with the reference." });
    }
  });
export type AnalysisOptions = z.output<typeof analysisOptionsSchema>;

export const assessmentAnalysisParams = z.object({ trialId: uuidSchema, assessmentId: uuidSchema }).strict();

const anovaRowSchema = z.object({ source: z.string(), df: z.number(), ss: z.number(), ms: z.number(), f: z.number().optional(), p: z.number().optional() });

export const assessmentResultsSchema = z.object({
  assessment: z.object({ id: z.string(), name: z.string(), variable: z.string(), unit: z.string(), timingDays: z.number().nullable() }),
  trial: z.object({ id: z.string(), design: z.string(), status: z.string() }),
  dataVersion: z.number(),
  computedAt: z.string(),
  options: z.object({
    transform: z.enum(transforms),
    method: z.enum(separationMethods),
    alpha: z.number(),
    control: z.string().nullable(),
    reference: z.string().nullable(),
    margin: z.number().nullable(),
  }),
  empty: z.boolean(),
  error: z.string().nullable(),
  anova: z.array(anovaRowSchema),
  grandMean: z.number().nullable(),
  cvPercent: z.number().nullable(),
  lsd: z.number().nullable(),
  residualDf: z.number().nullable(),
  treatmentTest: z.object({ f: z.number(), p: z.number(), significant: z.boolean() }).nullable(),
  means: z.array(
    z.object({
      treatment: z.string(),
      name: z.string(),
      n: z.number(),
      mean: z.number(),
      transformedMean: z.number().nullable(),
      se: z.number(),
      letters: z.string().nullable(),
      percentControl: z.number().nullable(),
      weedControlEfficiency: z.number().nullable(),
    }),
  ),
  lettersNote: z.string(),
  plotValues: z.array(z.object({ plotNumber: z.number(), block: z.number(), treatment: z.string(), value: z.number() })),
  lostPlots: z.array(z.number()),
  diagnostics: z.object({
    points: z.array(z.object({ plotNumber: z.number(), treatment: z.string(), fitted: z.number(), residual: z.number() })),
    qq: z.array(z.object({ theoretical: z.number(), sample: z.number() })),
    shapiroWilk: z.object({ w: z.number(), p: z.number() }).nullable(),
    levene: z.object({ f: z.number(), p: z.number() }).nullable(),
    advice: z.array(z.string()),
  }),
  equivalence: z
    .object({
      reference: z.string(),
      margin: z.number(),
      results: z.array(z.object({ treatment: z.string(), diff: z.number(), ci90: z.tuple([z.number(), z.number()]), p: z.number(), equivalent: z.boolean() })),
      conclusion: z.string(),
    })
    .nullable(),
  warnings: z.array(z.string()),
});
export type AssessmentResults = z.infer<typeof assessmentResultsSchema>;
