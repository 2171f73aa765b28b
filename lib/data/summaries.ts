import "server-only";
import { analyzeAssessment } from "@/lib/analysis/analyze-assessment";
import { dataStatusOf } from "@/lib/data/assessment-data";
import { treatmentCost } from "@/lib/economics/costs";
import { CURRENCY, DEFAULT_LABOUR_RATE_PER_HOUR, defaultCropPricePerKg } from "@/lib/economics/defaults";
import { db } from "@/lib/db/sequelize";
import { weedFinding, yieldFinding } from "@/lib/summaries/findings";
import { generateSummary } from "@/lib/summaries/generate";
import type { SummaryNumbers } from "@/lib/summaries/numbers";
import type { GeneratedSummary, WeedFinding, YieldFinding } from "@/lib/summaries/types";
import { Assessment, Site, Treatment, TrialSummary, type Trial } from "@/models";

const CONFIDENCE = 0.95;
/** Equivalence margins: ±10 percentage points of weed control, ±10% of the reference's yield. */
const WEED_MARGIN_POINTS = 10;
const YIELD_MARGIN_SHARE = 0.1;

function tryAnalysis<T>(work: () => Promise<T>): Promise<T | null> {
  // A result the engine cannot compute (too few plots, no check values) leaves that part out.
  return work().catch((error: unknown) => {
    if (error instanceof Error && error.name === "StatsInputError") return null;
    throw error;
  });
}

async function weedsOf(trial: Trial, assessments: Assessment[], withData: Set<string>, treatments: Treatment[]): Promise<WeedFinding | null> {
  const check = treatments.find((treatment) => treatment.checkType === "weedy");
  if (!check) return null;
  const pick = (variable: string) => assessments.filter((assessment) => assessment.variable === variable && withData.has(assessment.id)).at(-1);
  const assessment = pick("weed-density") ?? pick("weed-biomass");
  if (!assessment) return null;
  const hand = treatments.find((treatment) => treatment.category === "hand" && treatment.checkType === null);
  const options = {
    assessmentName: assessment.name,
    measure: assessment.variable as WeedFinding["measure"],
    daysAfterPlanting: assessment.timingReference === "planting" ? assessment.timingDays : null,
    checkCode: check.code,
    confidence: CONFIDENCE,
  };
  return tryAnalysis(async () => {
    const first = await analyzeAssessment(trial, assessment, { control: check.code });
    const plain = weedFinding(first.analysis, { ...options, unit: first.unit });
    if (!plain || !hand) return plain;
    // Equivalence to hand weeding within ±10 points of control is ±10% of the check's mean.
    const margin = (WEED_MARGIN_POINTS / 100) * plain.checkMean;
    const second = await analyzeAssessment(trial, assessment, { control: check.code, reference: hand.code, margin });
    return weedFinding(second.analysis, { ...options, unit: second.unit, reference: { code: hand.code, marginPoints: WEED_MARGIN_POINTS } });
  });
}

async function yieldOf(trial: Trial, assessments: Assessment[], withData: Set<string>, treatments: Treatment[]): Promise<YieldFinding | null> {
  const assessment = assessments.filter((item) => item.variable === "crop-yield" && withData.has(item.id)).at(-1);
  if (!assessment) return null;
  const hand = treatments.find((treatment) => treatment.category === "hand" && treatment.checkType === null);
  const weedFree = treatments.find((treatment) => treatment.checkType === "weed-free");
  const reference = hand ? { code: hand.code, kind: "hand" as const } : weedFree ? { code: weedFree.code, kind: "weed-free" as const } : null;
  if (!reference) return null;
  const weedy = treatments.find((treatment) => treatment.checkType === "weedy");
  return tryAnalysis(async () => {
    const first = await analyzeAssessment(trial, assessment);
    if (first.unit !== "t/ha") return null;
    const options = { assessmentName: assessment.name, reference, marginShare: YIELD_MARGIN_SHARE, weedyCheckCode: weedy?.code ?? null, confidence: CONFIDENCE };
    const plain = yieldFinding(first.analysis, options);
    if (!plain) return null;
    const second = await analyzeAssessment(trial, assessment, { reference: reference.code, margin: plain.margin });
    return yieldFinding(second.analysis, options);
  });
}

/** The numbers behind a summary, from the trial's current (reviewed) results. */
export async function summaryNumbersOf(trial: Trial): Promise<SummaryNumbers> {
  db();
  const [site, treatments, assessments, status] = await Promise.all([
    Site.findByPk(trial.siteId),
    Treatment.findAll({ where: { trialId: trial.id }, order: [["position", "ASC"]] }),
    Assessment.findAll({ where: { trialId: trial.id }, order: [["position", "ASC"]] }),
    dataStatusOf(trial.id),
  ]);
  const withData = new Set(status.filter((line) => line.values > 0).map((line) => line.id));
  const [weeds, yieldResult] = await Promise.all([weedsOf(trial, assessments, withData, treatments), yieldOf(trial, assessments, withData, treatments)]);
  const costInputs = treatments.map((treatment) => ({
    code: treatment.code,
    name: treatment.name,
    category: treatment.category,
    checkType: treatment.checkType,
    passes: treatment.passes,
    labourHoursPerHa: treatment.labourHoursPerHa,
    materialCostPerHa: treatment.materialCostPerHa,
    equipmentCost: treatment.equipmentCost,
    equipmentLifeYears: treatment.equipmentLifeYears,
    equipmentHaPerYear: treatment.equipmentHaPerYear,
  }));
  const labourRatePerHour = DEFAULT_LABOUR_RATE_PER_HOUR;
  return {
    version: 1,
    generatedAt: new Date().toISOString(),
    input: {
      trial: {
        title: trial.title,
        crop: trial.crop,
        season: trial.season,
        siteName: site?.name ?? "",
        region: site?.region ?? "",
        plantingDate: trial.plantingDate,
        replicates: trial.blocks,
      },
      sites: 1,
      confidence: CONFIDENCE,
      methods: treatments.map((treatment) => ({ code: treatment.code, name: treatment.name, category: treatment.category, checkType: treatment.checkType })),
      weeds,
      yield: yieldResult,
      costs: costInputs.map((input) => {
        const cost = treatmentCost(input, labourRatePerHour);
        return { code: input.code, totalPerHa: cost.totalPerHa, labourHoursPerHa: cost.labourHoursPerHa, incomplete: cost.missing.length > 0 };
      }),
      labourRatePerHour,
      currency: CURRENCY,
    },
    costInputs,
    defaults: { labourRatePerHour, cropPricePerKg: defaultCropPricePerKg(trial.crop) },
  };
}

/**
 * An edit made against other generated text than `generatedNow` may quote numbers that have
 * changed since; an edit whose starting text was not kept counts as such, since nobody can tell.
 */
export function editIsStale(record: Pick<TrialSummary, "editedText" | "generatedText"> | null, generatedNow: string): boolean {
  return Boolean(record?.editedText) && record!.generatedText !== generatedNow;
}

export interface SummaryView {
  numbers: SummaryNumbers;
  generated: GeneratedSummary;
  /** The text readers see: published text, else the researcher's edit, else the generated text. */
  text: string;
  edited: boolean;
  /** A draft's edit was made before the results (so the generated text) last changed. */
  generatedChangedSinceEdit: boolean;
  published: { at: Date; text: string } | null;
  record: TrialSummary | null;
}

/**
 * A trial's summary as it stands. A published summary reads its stored snapshot, so the text
 * and its numbers stay together even if data change later; a draft is generated afresh.
 */
export async function summaryOf(trial: Trial): Promise<SummaryView> {
  db();
  const record = await TrialSummary.findOne({ where: { trialId: trial.id } });
  if (record?.publishedText && record.numbers) {
    const numbers = record.numbers as SummaryNumbers;
    const generated = generateSummary(numbers.input);
    return { numbers, generated, text: record.publishedText, edited: record.publishedText !== record.generatedText, generatedChangedSinceEdit: false, published: { at: record.publishedAt!, text: record.publishedText }, record };
  }
  const numbers = await summaryNumbersOf(trial);
  const generated = generateSummary(numbers.input);
  return {
    numbers,
    generated,
    text: record?.editedText ?? generated.text,
    edited: Boolean(record?.editedText),
    generatedChangedSinceEdit: editIsStale(record, generated.text),
    published: null,
    record,
  };
}
