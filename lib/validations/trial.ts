import { z } from "zod";
import {
  assessmentVariables,
  checkTypes,
  membershipRoles,
  methodCategories,
  timingReferences,
  trialDesigns,
  trialStatuses,
} from "@/lib/trials/vocabulary";

/*
 * The trial wizard's schemas. Each step's form resolves with the same schema its API route
 * validates, so a message shown next to a field in the browser is the one the server would send.
 * Inputs come as strings from forms and as numbers from JSON; both parse.
 */

const blankToNull = (value: unknown) => (value === "" || value === undefined ? null : value);

function optionalNumber(message: string, { min = 0, max = 1e9 }: { min?: number; max?: number } = {}) {
  return z.preprocess(
    (value) => (blankToNull(value) === null ? null : typeof value === "string" ? Number(value) : value),
    z.number(message).min(min, message).max(max, message).nullable(),
  );
}

function requiredNumber(message: string, { min, max, integer = false }: { min: number; max: number; integer?: boolean }) {
  const base = integer ? z.number(message).int(message) : z.number(message);
  return z.preprocess(
    (value) => (value === "" || value === null || value === undefined ? undefined : typeof value === "string" ? Number(value) : value),
    base.min(min, message).max(max, message),
  );
}

const optionalDate = z.preprocess(blankToNull, z.iso.date("Enter a date as YYYY-MM-DD.").nullable());
const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`).default("");

export const trialBasicsSchema = z
  .object({
    title: z.string().trim().min(3, "Give the trial a title of at least 3 characters.").max(200, "Use at most 200 characters."),
    crop: z.string().trim().min(2, "Name the crop.").max(80, "Use at most 80 characters."),
    season: z.string().trim().regex(/^\d{4}(\/\d{2,4})?$/, "Enter the season as a year, such as 2026 (or 2026/27)."),
    siteId: z.uuid("Choose a site."),
    objective: text(4000),
    plantingDate: optionalDate,
  })
  .strict();
export type TrialBasicsInput = z.input<typeof trialBasicsSchema>;
export type TrialBasics = z.output<typeof trialBasicsSchema>;

export const siteSchema = z
  .object({
    name: z.string().trim().min(2, "Name the site.").max(160, "Use at most 160 characters."),
    location: z.string().trim().min(2, "Say where on the site (field, block, bed set).").max(200, "Use at most 200 characters."),
    region: z.string().trim().min(2, "Name the region.").max(120, "Use at most 120 characters."),
    soil: text(200),
    notes: text(2000),
  })
  .strict();
export type SiteInput = z.input<typeof siteSchema>;

export const treatmentSchema = z
  .object({
    id: z.preprocess(blankToNull, z.uuid().nullable()).optional(),
    code: z.string().trim().min(1, "Give a short code, such as T1.").max(8, "Use at most 8 characters.").regex(/^[A-Za-z0-9-]+$/, "Use letters, digits and dashes only."),
    name: z.string().trim().min(2, "Name the treatment.").max(120, "Use at most 120 characters."),
    category: z.enum(methodCategories, "Choose a method."),
    checkType: z.preprocess(blankToNull, z.enum(checkTypes).nullable()),
    description: text(2000),
    timing: text(200),
    rateOrSettings: text(200),
    labourHoursPerHa: optionalNumber("Enter hours per hectare as a number, 0 or more.", { max: 10000 }),
    materialCostPerHa: optionalNumber("Enter a cost per hectare as a number, 0 or more.", { max: 1e7 }),
  })
  .strict()
  .superRefine((treatment, context) => {
    if (treatment.category === "check" && !treatment.checkType) {
      context.addIssue({ code: "custom", path: ["checkType"], message: "Say whether this is the weedy or the weed-free check." });
    }
    if (treatment.category !== "check" && treatment.checkType) {
      context.addIssue({ code: "custom", path: ["checkType"], message: "Only a check treatment is a weedy or weed-free check." });
    }
  });
export type TreatmentInput = z.input<typeof treatmentSchema>;
export type TreatmentValues = z.output<typeof treatmentSchema>;

export const MAX_TREATMENTS = 40;

export const trialTreatmentsSchema = z
  .object({
    treatments: z.array(treatmentSchema).min(1, "Add at least one treatment.").max(MAX_TREATMENTS, `A trial has at most ${MAX_TREATMENTS} treatments.`),
  })
  .strict()
  .superRefine(({ treatments }, context) => {
    const seen = new Map<string, number>();
    treatments.forEach((treatment, index) => {
      const key = treatment.code.toUpperCase();
      if (seen.has(key)) context.addIssue({ code: "custom", path: ["treatments", index, "code"], message: `Code ${treatment.code} is already used by treatment ${seen.get(key)! + 1}.` });
      else seen.set(key, index);
    });
    for (const checkType of checkTypes) {
      const indexes = treatments.flatMap((treatment, index) => (treatment.checkType === checkType ? [index] : []));
      for (const index of indexes.slice(1)) {
        context.addIssue({ code: "custom", path: ["treatments", index, "checkType"], message: `The trial already has a ${checkType} check.` });
      }
    }
  });
export type TrialTreatmentsInput = z.input<typeof trialTreatmentsSchema>;

export const MAX_SEED = 2_147_483_647;

export const trialDesignSchema = z
  .object({
    design: z.enum(trialDesigns, "Choose a design."),
    blocks: requiredNumber("Use between 2 and 20 blocks.", { min: 2, max: 20, integer: true }),
    plotLengthM: requiredNumber("Enter the plot length in metres (0.5 to 500).", { min: 0.5, max: 500 }),
    plotWidthM: requiredNumber("Enter the plot width in metres (0.3 to 100).", { min: 0.3, max: 100 }),
    harvestAreaM2: requiredNumber("Enter the harvest area in m² (more than 0).", { min: 0.01, max: 50000 }),
    quadratAreaM2: requiredNumber("Enter the quadrat area in m² (more than 0).", { min: 0.01, max: 100 }),
    serpentine: z.preprocess((value) => value === true || value === "true" || value === "on", z.boolean()),
    randomSeed: requiredNumber(`Use a whole number from 1 to ${MAX_SEED}.`, { min: 1, max: MAX_SEED, integer: true }),
  })
  .strict()
  .superRefine((design, context) => {
    const plotArea = design.plotLengthM * design.plotWidthM;
    if (design.harvestAreaM2 > plotArea + 1e-9) {
      context.addIssue({ code: "custom", path: ["harvestAreaM2"], message: `The harvest area cannot be larger than the plot (${round(plotArea)} m²).` });
    }
    if (design.quadratAreaM2 > plotArea + 1e-9) {
      context.addIssue({ code: "custom", path: ["quadratAreaM2"], message: `The quadrat cannot be larger than the plot (${round(plotArea)} m²).` });
    }
  });
export type TrialDesignInput = z.input<typeof trialDesignSchema>;
export type TrialDesignValues = z.output<typeof trialDesignSchema>;

function round(value: number): number {
  return Math.round(value * 100) / 100;
}

export const assessmentSchema = z
  .object({
    id: z.preprocess(blankToNull, z.uuid().nullable()).optional(),
    name: z.string().trim().min(2, "Name the assessment.").max(120, "Use at most 120 characters."),
    variable: z.enum(assessmentVariables, "Choose what is measured."),
    unit: z.string().trim().min(1, "Give the unit values are recorded in.").max(40, "Use at most 40 characters."),
    plannedDate: optionalDate,
    timingDays: optionalNumber("Enter days as a whole number from 0 to 400.", { max: 400 }).refine((value) => value === null || Number.isInteger(value), "Enter days as a whole number from 0 to 400."),
    timingReference: z.preprocess(blankToNull, z.enum(timingReferences).nullable()),
    quadratsPerPlot: requiredNumber("Use 1 to 50 quadrats per plot.", { min: 1, max: 50, integer: true }),
    notes: text(2000),
  })
  .strict()
  .superRefine((assessment, context) => {
    if (assessment.timingDays !== null && !assessment.timingReference) {
      context.addIssue({ code: "custom", path: ["timingReference"], message: "Say whether the days count from planting or from treatment." });
    }
  });
export type AssessmentInput = z.input<typeof assessmentSchema>;
export type AssessmentValues = z.output<typeof assessmentSchema>;

export const trialAssessmentsSchema = z
  .object({ assessments: z.array(assessmentSchema).max(40, "A trial has at most 40 assessments.") })
  .strict();
export type TrialAssessmentsInput = z.input<typeof trialAssessmentsSchema>;

export const trialTeamSchema = z
  .object({
    members: z.array(z.object({ userId: z.uuid("Choose a person."), role: z.enum(membershipRoles, "Choose technician or reviewer.") }).strict()).max(50),
  })
  .strict()
  .superRefine(({ members }, context) => {
    const seen = new Set<string>();
    members.forEach((member, index) => {
      if (seen.has(member.userId)) context.addIssue({ code: "custom", path: ["members", index, "userId"], message: "This person is already on the team." });
      seen.add(member.userId);
    });
  });
export type TrialTeamInput = z.input<typeof trialTeamSchema>;

export const statusChangeSchema = z.object({ status: z.enum(trialStatuses, "Choose a status.") }).strict();

export const randomizeSchema = z
  .object({ newSeed: z.boolean().default(false) })
  .strict();

export const trialListQuerySchema = z
  .object({
    crop: z.string().trim().max(80).optional(),
    season: z.string().trim().max(20).optional(),
    status: z.preprocess(blankToNull, z.enum(trialStatuses).nullable()).optional(),
  })
  .strict();
export type TrialListQuery = z.output<typeof trialListQuerySchema>;

export const copyFromParams = z.object({ trialId: z.uuid("That id is not valid.") }).strict();
export const assessmentSheetParams = z.object({ trialId: z.uuid("That id is not valid."), assessmentId: z.uuid("That id is not valid.") }).strict();
/** Treatment codes are left off unless asked for, so scorers can score blind. */
export const sheetQuerySchema = z
  .object({ format: z.enum(["long", "wide"]).default("long"), treatments: z.enum(["hide", "show"]).default("hide") })
  .strict();
