import type { MethodCategory, CheckType } from "@/lib/trials/vocabulary";

/** A confidence range in the unit of the value it belongs to. */
export interface Range {
  low: number;
  high: number;
}

export interface SummaryMethod {
  code: string;
  name: string;
  category: MethodCategory;
  checkType: CheckType | null;
}

/** What one method did to weeds, against the weedy check. */
export interface WeedResult {
  code: string;
  /** Mean weeds left, in the finding's unit. */
  mean: number;
  percentControl: number;
  /** 95% range of percent control, from the range of the difference from the check. */
  percentRange: Range | null;
  /** The analysis found a difference from the weedy check (the range excludes zero). */
  detected: boolean;
  /** Equivalence to the reference method within the margin (TOST), when it was tested. */
  similarToReference: boolean | null;
}

export interface WeedFinding {
  assessmentName: string;
  measure: "weed-density" | "weed-biomass";
  unit: string;
  daysAfterPlanting: number | null;
  checkCode: string;
  checkMean: number;
  results: WeedResult[];
  /** Reference for "similar to" (usually hand weeding) and its margin in percentage points of control. */
  reference: { code: string; marginPoints: number } | null;
}

export interface YieldResult {
  code: string;
  mean: number;
  /** Method − reference, t/ha, with its 95% range. */
  difference: number;
  differenceRange: Range | null;
  detected: boolean;
  /** TOST within ±margin of the reference; null when not tested. */
  equivalent: boolean | null;
}

export interface YieldFinding {
  assessmentName: string;
  unit: "t/ha";
  reference: { code: string; kind: "hand" | "weed-free"; mean: number };
  /** Equivalence margin as a share of the reference yield (0.1 = 10%) and in t/ha. */
  marginShare: number;
  margin: number;
  results: YieldResult[];
  /** Method − weedy check, for the partial budget. */
  againstWeedyCheck: Array<{ code: string; difference: number; differenceRange: Range | null }>;
  weedyCheckMean: number | null;
}

export interface MethodCost {
  code: string;
  totalPerHa: number;
  labourHoursPerHa: number;
  incomplete: boolean;
}

export interface SummaryInput {
  trial: {
    title: string;
    crop: string;
    season: string;
    siteName: string;
    region: string;
    plantingDate: string | null;
    replicates: number;
  };
  /** How many trials (site-seasons) these results come from. */
  sites: number;
  /** Confidence level of every range, e.g. 0.95. */
  confidence: number;
  methods: SummaryMethod[];
  weeds: WeedFinding | null;
  yield: YieldFinding | null;
  costs: MethodCost[];
  labourRatePerHour: number;
  currency: string;
}

export interface SummarySection {
  key: "compared" | "where" | "weeds" | "yield" | "costs" | "caveats";
  heading: string;
  paragraphs: string[];
}

export interface GeneratedSummary {
  sections: SummarySection[];
  /** The sections as plain text: headings on their own line, paragraphs split by blank lines. */
  text: string;
}
