import "server-only";
import packageJson from "@/package.json";
import { assessmentResults, defaultControl } from "@/lib/analysis/assessment-results";
import { assessmentsOf, type AssessmentRecord } from "@/lib/data/assessments";
import { reviewStateOf, type ReviewState } from "@/lib/data/reviews";
import { treatmentsOf, type TreatmentRecord } from "@/lib/data/treatments";
import { trialOverview, type TrialOverview } from "@/lib/data/trials";
import { fieldPlan, type FieldPlan } from "@/lib/trials/field-sheets";
import type { Trial } from "@/models";
import { analysisOptionsSchema, type AnalysisOptions, type AssessmentResults } from "@/lib/validations/analysis";
import { methodsParagraph } from "./methods";

export interface TrialReport {
  overview: TrialOverview;
  treatments: TreatmentRecord[];
  plan: FieldPlan;
  sections: Array<{ assessment: AssessmentRecord; results: AssessmentResults }>;
  review: ReviewState | null;
  options: AnalysisOptions;
  methods: string;
  version: string;
  generatedAt: string;
}

export const softwareVersion = packageJson.version;

/** Everything the technical report shows, analysed with one set of options (the weedy check as control by default). */
export async function trialReport(trial: Trial, requested: Partial<AnalysisOptions> = {}): Promise<TrialReport> {
  const [overview, treatments, assessments, plan, review] = await Promise.all([trialOverview(trial), treatmentsOf(trial.id), assessmentsOf(trial.id), fieldPlan(trial), reviewStateOf(trial.id)]);
  const control = requested.control ?? defaultControl(treatments.map((treatment) => ({ code: treatment.code, name: treatment.name, checkType: treatment.checkType })));
  const options = analysisOptionsSchema.parse({ ...requested, control });
  const sections = await Promise.all(
    assessments.map(async (assessment) => ({ assessment, results: (await assessmentResults(trial, assessment.id, options)).results })),
  );
  return {
    overview,
    treatments,
    plan,
    sections,
    review,
    options,
    version: softwareVersion,
    generatedAt: new Date().toISOString(),
    methods: methodsParagraph({
      design: trial.design,
      blocks: trial.blocks,
      treatments: treatments.length,
      quadratAreaM2: trial.quadratAreaM2,
      options,
      control: control ?? null,
      version: softwareVersion,
      anyUnbalanced: sections.some((section) => !section.results.empty && section.results.lsd === null),
    }),
  };
}
