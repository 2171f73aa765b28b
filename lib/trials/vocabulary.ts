/*
 * The closed vocabularies of a trial plan. They live here, free of Sequelize, so forms in the
 * browser and the zod schemas can use them; the models re-export them for the database side.
 */

export const trialDesigns = ["rcbd", "crd", "latin"] as const;
export type TrialDesign = (typeof trialDesigns)[number];
export const trialStatuses = ["draft", "active", "locked", "published"] as const;
export type TrialStatus = (typeof trialStatuses)[number];

export const methodCategories = ["check", "hand", "mulch", "cultivation", "thermal", "robotic", "chemical", "other"] as const;
export type MethodCategory = (typeof methodCategories)[number];
export const checkTypes = ["weedy", "weed-free"] as const;
export type CheckType = (typeof checkTypes)[number];

export const assessmentVariables = [
  "weed-density",
  "weed-biomass",
  "crop-yield",
  "crop-injury",
  "weed-control-rating",
  "labour-time",
  "custom",
] as const;
export type AssessmentVariable = (typeof assessmentVariables)[number];
export const timingReferences = ["planting", "treatment"] as const;
export type TimingReference = (typeof timingReferences)[number];

export const membershipRoles = ["technician", "reviewer"] as const;
export type MembershipRole = (typeof membershipRoles)[number];
