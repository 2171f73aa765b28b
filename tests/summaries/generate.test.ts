import { describe, expect, it } from "vitest";
import { generateSummary, parseSummaryText } from "@/lib/summaries/generate";
import type { SummaryInput, WeedResult, YieldResult } from "@/lib/summaries/types";

// Hand-made result cases; the numbers are chosen for the wording, not taken from any trial.
function input(overrides: Partial<SummaryInput> = {}): SummaryInput {
  return {
    trial: { title: "Test trial", crop: "Onion", season: "2025", siteName: "North Field", region: "Test Valley", plantingDate: "2025-04-22", replicates: 4 },
    sites: 1,
    confidence: 0.95,
    methods: [
      { code: "WC", name: "Weedy check", category: "check", checkType: "weedy" },
      { code: "WF", name: "Weed-free check", category: "check", checkType: "weed-free" },
      { code: "HH", name: "Hand hoeing", category: "hand", checkType: null },
      { code: "SM", name: "Straw mulch", category: "mulch", checkType: null },
      { code: "FL", name: "Flame weeding", category: "thermal", checkType: null },
    ],
    weeds: {
      assessmentName: "Weed density, 42 days after planting",
      measure: "weed-density",
      unit: "plants/m²",
      daysAfterPlanting: 42,
      checkCode: "WC",
      checkMean: 120,
      results: [
        weed({ code: "HH", percentControl: 88.4, percentRange: { low: 75.2, high: 101.5 }, detected: true }),
        weed({ code: "SM", percentControl: 22, percentRange: { low: -10, high: 54 }, detected: false }),
        weed({ code: "FL", percentControl: 80, percentRange: { low: 66, high: 94 }, detected: true, similarToReference: true }),
      ],
      reference: { code: "HH", marginPoints: 10 },
    },
    yield: {
      assessmentName: "Crop yield",
      unit: "t/ha",
      reference: { code: "HH", kind: "hand", mean: 2.5 },
      marginShare: 0.1,
      margin: 0.25,
      results: [
        yieldResult({ code: "SM", mean: 1.7, difference: -0.8, differenceRange: { low: -1.2, high: -0.4 }, detected: true, equivalent: false }),
        yieldResult({ code: "FL", mean: 2.45, difference: -0.05, differenceRange: { low: -0.2, high: 0.1 }, detected: false, equivalent: true }),
        yieldResult({ code: "WC", mean: 2.2, difference: -0.3, differenceRange: { low: -0.7, high: 0.1 }, detected: false, equivalent: false }),
      ],
      againstWeedyCheck: [],
      weedyCheckMean: 2.2,
    },
    costs: [
      { code: "HH", totalPerHa: 1530, labourHoursPerHa: 85, incomplete: false },
      { code: "SM", totalPerHa: 1476, labourHoursPerHa: 42, incomplete: false },
      { code: "FL", totalPerHa: 306, labourHoursPerHa: 7, incomplete: true },
    ],
    labourRatePerHour: 18,
    currency: "$",
    ...overrides,
  };
}

function weed(result: Partial<WeedResult> & { code: string }): WeedResult {
  return { mean: 10, percentControl: 0, percentRange: null, detected: false, similarToReference: null, ...result };
}
function yieldResult(result: Partial<YieldResult> & { code: string }): YieldResult {
  return { mean: 2, difference: 0, differenceRange: null, detected: false, equivalent: null, ...result };
}

const paragraph = (summary: ReturnType<typeof generateSummary>, start: string) =>
  summary.sections.flatMap((section) => section.paragraphs).find((text) => text.startsWith(start)) ?? "";

describe("plain-language summary wording", () => {
  it("a detected reduction gives the percent with its range, capped at 100%", () => {
    const summary = generateSummary(input());
    expect(paragraph(summary, "Hand hoeing")).toBe("Hand hoeing reduced weeds by about 88% compared with no weeding (range 75% to 100%).");
  });

  it("a difference the analysis did not detect is 'no clear difference in this trial', never 'the same'", () => {
    const summary = generateSummary(input());
    const mulch = paragraph(summary, "Straw mulch: no clear difference from no weeding");
    expect(mulch).toBe("Straw mulch: no clear difference from no weeding in this trial. Weeds were 22% fewer on average, but the range (−10% to 54%) includes no reduction at all.");
    expect(summary.text).not.toMatch(/\bsame\b/i);
    expect(summary.text).not.toMatch(/\bno effect\b/i);
  });

  it("'similar to hand weeding' only where the equivalence test says so, with the margin", () => {
    const summary = generateSummary(input());
    expect(paragraph(summary, "Flame weeding reduced")).toContain("similar to hand hoeing: an equivalence test placed the difference within 10 percentage points of control either way.");
    expect(paragraph(summary, "Flame weeding: yield similar")).toBe(
      "Flame weeding: yield similar to hand hoeing, at 2.45 t/ha (2,186 lb/acre); an equivalence test placed the difference within ±10% of the yield of hand hoeing (±0.25 t/ha).",
    );
    // Straw mulch and the weedy check were not shown equivalent: the word "similar" never names them.
    for (const line of summary.sections.flatMap((section) => section.paragraphs)) {
      if (/similar/.test(line)) expect(line).toMatch(/^Flame weeding/);
    }
  });

  it("a detected yield difference gives its size in both units and its range", () => {
    const summary = generateSummary(input());
    expect(paragraph(summary, "Straw mulch yielded")).toBe("Straw mulch yielded 0.8 t/ha (714 lb/acre) less than hand hoeing (range of the difference −1.2 to −0.4 t/ha).");
  });

  it("not detected and not equivalent says both, without 'similar'", () => {
    const summary = generateSummary(input());
    const check = paragraph(summary, "Weedy check: no clear difference in yield");
    expect(check).toContain("no clear difference in yield from hand hoeing in this trial");
    expect(check).toContain("Nor could the trial show that its yield is within ±10% of the yield of hand hoeing (±0.25 t/ha).");
    expect(check).not.toContain("similar");
  });

  it("a rise in weeds the analysis did not detect says 'more weeds', not 'fewer'", () => {
    const weeds = { ...input().weeds!, results: [weed({ code: "SM", percentControl: -5.4, percentRange: { low: -30, high: 19 }, detected: false })] };
    const mulch = paragraph(generateSummary(input({ weeds })), "Straw mulch");
    expect(mulch).toBe("Straw mulch: no clear difference from no weeding in this trial. There were 5% more weeds on average, but the range of control (−30% to 19%) includes no change at all.");
    expect(mulch).not.toContain("fewer");
  });

  it("an average change under 1% is said to be under 1%, not '0% fewer'", () => {
    const weeds = { ...input().weeds!, results: [weed({ code: "SM", percentControl: 0.3, percentRange: { low: -20, high: 21 }, detected: false })] };
    expect(paragraph(generateSummary(input({ weeds })), "Straw mulch")).toBe(
      "Straw mulch: no clear difference from no weeding in this trial. On average, weeds were within 1% of no weeding (range of control −20% to 21%).",
    );
  });

  it("weed control not shown equivalent says the trial could not show it, and never 'similar'", () => {
    const weeds = { ...input().weeds!, results: [weed({ code: "FL", percentControl: 62, percentRange: { low: 48, high: 76 }, detected: true, similarToReference: false })] };
    const flame = paragraph(generateSummary(input({ weeds })), "Flame weeding reduced");
    expect(flame).toBe(
      "Flame weeding reduced weeds by about 62% compared with no weeding (range 48% to 76%). The trial could not show that its weed control was within 10 percentage points of hand hoeing either way.",
    );
    expect(flame).not.toContain("similar");
  });

  it("weed density is given in plants/m² and plants/ft²", () => {
    // 120 plants/m² × 0.09290304 m²/ft² (1 ft = 0.3048 m exactly; NIST SP 811, Appendix B) = 11.148 plants/ft²
    expect(paragraph(generateSummary(input()), "Weeds were counted")).toBe("Weeds were counted 42 days after planting. Without weeding there were 120 plants/m² (11.1 plants/ft²) on average.");
  });

  it("weed biomass is given in g/m² and lb/acre", () => {
    const weeds = { ...input().weeds!, measure: "weed-biomass" as const, unit: "g/m²" };
    // 120 g/m² = 1 200 kg/ha; × 0.40468564224 ha/acre ÷ 0.45359237 kg/lb (NIST SP 811, Appendix B) = 1 070.6 lb/acre
    expect(paragraph(generateSummary(input({ weeds })), "Weeds were cut and weighed")).toBe(
      "Weeds were cut and weighed 42 days after planting. Without weeding there were 120 g/m² (1,071 lb/acre) on average.",
    );
  });

  it("states what the ranges mean, and that percent ranges take the weedy check's average as exact", () => {
    const text = generateSummary(input()).text;
    expect(text).toContain("Each range is a 95% confidence range");
    expect(text).toContain(
      "The percent ranges allow for the variation between plots in the difference from no weeding, but take the average without weeding as exact; that average is an estimate too, so the true ranges are somewhat wider than shown.",
    );
    const noRanges = { ...input().weeds!, results: input().weeds!.results.map((result) => ({ ...result, percentRange: null })) };
    expect(generateSummary(input({ weeds: noRanges })).text).not.toContain("percent ranges");
  });

  it("one trial at one site is said to be one trial at one site", () => {
    const summary = generateSummary(input());
    expect(summary.text).toContain("This is one trial at one site: North Field (Test Valley), in the 2025 season, planted on 2025-04-22.");
    expect(summary.text).toContain("These results are from one trial at one site in one season");
  });

  it("several sites are said to be several sites", () => {
    const summary = generateSummary(input({ sites: 3 }));
    expect(summary.text).toContain("These results combine 3 trials at 3 sites");
    expect(summary.text).not.toContain("one trial at one site");
  });

  it("costs per acre and per hectare with labour, the labour rate stated, incomplete costs flagged", () => {
    const summary = generateSummary(input());
    // $1 530/ha × 0.40468564224 = $619.17 per acre; 85 h/ha × 0.40468564224 = 34.4 h per acre
    expect(paragraph(summary, "Hand hoeing cost")).toBe("Hand hoeing cost about $619 per acre ($1,530 per hectare) for the season, including 34.4 hours per acre (85 per hectare) of labour.");
    expect(paragraph(summary, "Flame weeding cost")).toContain("Some costs were not recorded");
    expect(summary.text).toContain("Labour is costed at $18 an hour");
  });

  it("a method with no recorded costs says so instead of costing nothing", () => {
    const summary = generateSummary(input({ costs: [{ code: "HH", totalPerHa: 0, labourHoursPerHa: 0, incomplete: true }] }));
    expect(summary.text).toContain("The trial did not record what hand hoeing cost.");
    expect(summary.text).not.toContain("$0 per acre");
  });

  it("thermal, chemical and machinery methods carry the cautions and who governs", () => {
    const summary = generateSummary(input());
    expect(summary.text).toContain("Flame weeding carries safety risks; read the cautions below. The product label and local regulations govern, not this summary.");
    const handOnly = generateSummary(input({ methods: input().methods.filter((method) => method.code !== "FL") }));
    expect(handOnly.text).not.toContain("safety risks");
    expect(handOnly.text).toContain("not a recommendation");
  });

  it("says so when there are no results yet", () => {
    const summary = generateSummary(input({ weeds: null, yield: null }));
    expect(summary.text).toContain("The trial's results are not available yet.");
  });

  it("the text round-trips through the editor format", () => {
    const summary = generateSummary(input());
    const parsed = parseSummaryText(summary.text);
    expect(parsed.map((section) => section.heading)).toEqual(summary.sections.map((section) => section.heading));
    expect(parsed[2].paragraphs).toEqual(summary.sections[2].paragraphs);
  });
});
