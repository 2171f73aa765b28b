import { cautionsFor } from "@/lib/safety/cautions";
import { hoursPerAreaBoth, list, measureBoth, money, moneyPerAreaBoth, number, percent, percentRangeText, yieldBoth } from "./format";
import type { GeneratedSummary, SummaryInput, SummaryMethod, SummarySection, WeedFinding, WeedResult, YieldResult } from "./types";

/*
 * The plain-language summary of a trial, from reviewed results. Wording rules (tested in
 * tests/summaries): a difference the analysis did not detect is "no clear difference in this
 * trial", never "the same"; "similar to hand weeding" only where the equivalence test supports
 * it, with the margin stated; every estimate carries its range and what the range means; one
 * trial at one site says so. Pure: no database, no clock.
 */

const checkNames = { weedy: "no weeding (the weedy check)", "weed-free": "the weed-free check" } as const;

function nameOf(input: SummaryInput, code: string): string {
  return input.methods.find((method) => method.code === code)?.name ?? code;
}

function comparedMethods(input: SummaryInput): SummaryMethod[] {
  return input.methods.filter((method) => method.checkType === null);
}

function rangeMeaning(input: SummaryInput, weeds: WeedFinding): string {
  const level = Math.round(input.confidence * 100);
  const meaning = `Each range is a ${level}% confidence range: plots given one method differ from each other, and given that variation the true effect at this site is likely to lie within the range. A wider range means a less certain result.`;
  if (!weeds.results.some((result) => result.percentRange)) return meaning;
  // Percent ranges divide by the weedy check's average as if it were known (lib/summaries/findings.ts); say so.
  return `${meaning} The percent ranges allow for the variation between plots in the difference from no weeding, but take the average without weeding as exact; that average is an estimate too, so the true ranges are somewhat wider than shown.`;
}

function comparedSection(input: SummaryInput): SummarySection {
  const methods = comparedMethods(input);
  const checks = input.methods.filter((method) => method.checkType !== null).map((method) => checkNames[method.checkType!]);
  const names = methods.map((method) => method.name.toLowerCase());
  const against = checks.length > 0 ? ` against ${list(checks)}` : "";
  return {
    key: "compared",
    heading: "What was compared",
    paragraphs: [
      `This trial compared ${methods.length === 1 ? "one weed control method" : `${methods.length} weed control methods`} in ${input.trial.crop.toLowerCase()}${against}: ${list(names)}.`,
    ],
  };
}

function whereSection(input: SummaryInput): SummarySection {
  const { trial } = input;
  const planted = trial.plantingDate ? `, planted on ${trial.plantingDate}` : "";
  const scope =
    input.sites === 1
      ? `This is one trial at one site: ${trial.siteName} (${trial.region}), in the ${trial.season} season${planted}.`
      : `These results combine ${input.sites} trials at ${input.sites} sites in the ${trial.season} season; the first listed site is ${trial.siteName} (${trial.region}).`;
  return {
    key: "where",
    heading: "Where and when",
    paragraphs: [`${scope} Each method was tried on ${trial.replicates} plots, laid out at random.`],
  };
}

function weedSentence(input: SummaryInput, result: WeedResult, referenceCode: string | null, marginPoints: number | null): string {
  const name = nameOf(input, result.code);
  const range = result.percentRange ? percentRangeText(result.percentRange.low, result.percentRange.high) : null;
  let sentence: string;
  if (!result.detected) {
    const rounded = Math.round(result.percentControl);
    const average =
      rounded > 0
        ? `Weeds were ${percent(result.percentControl)} fewer on average${range ? `, but the range (${range}) includes no reduction at all` : ""}`
        : rounded < 0
          ? `There were ${percent(-result.percentControl)} more weeds on average${range ? `, but the range of control (${range}) includes no change at all` : ""}`
          : `On average, weeds were within 1% of no weeding${range ? ` (range of control ${range})` : ""}`;
    sentence = `${name}: no clear difference from no weeding in this trial. ${average}.`;
  } else if (result.percentControl > 0) {
    sentence = `${name} reduced weeds by about ${percent(result.percentControl)} compared with no weeding${range ? ` (range ${range})` : ""}.`;
  } else {
    sentence = `${name} left more weeds than no weeding: ${percent(-result.percentControl)} more on average${range ? ` (range of control ${range})` : ""}.`;
  }
  if (referenceCode && result.code !== referenceCode && result.similarToReference === true && marginPoints !== null) {
    sentence += ` Its weed control was similar to ${nameOf(input, referenceCode).toLowerCase()}: an equivalence test placed the difference within ${number(marginPoints, 0)} percentage points of control either way.`;
  } else if (referenceCode && result.code !== referenceCode && result.similarToReference === false && marginPoints !== null) {
    sentence += ` The trial could not show that its weed control was within ${number(marginPoints, 0)} percentage points of ${nameOf(input, referenceCode).toLowerCase()} either way.`;
  }
  return sentence;
}

function weedsSection(input: SummaryInput): SummarySection | null {
  const weeds = input.weeds;
  if (!weeds) return null;
  const when = weeds.daysAfterPlanting !== null ? `${weeds.daysAfterPlanting} days after planting` : `at "${weeds.assessmentName}"`;
  const what = weeds.measure === "weed-density" ? "Weeds were counted" : "Weeds were cut and weighed";
  const order = comparedMethods(input).map((method) => method.code);
  const results = weeds.results.filter((result) => order.includes(result.code)).sort((a, b) => order.indexOf(a.code) - order.indexOf(b.code));
  return {
    key: "weeds",
    heading: "Weeds",
    paragraphs: [
      `${what} ${when}. Without weeding there were ${measureBoth(weeds.checkMean, weeds.unit)} on average.`,
      ...results.map((result) => weedSentence(input, result, weeds.reference?.code ?? null, weeds.reference?.marginPoints ?? null)),
      rangeMeaning(input, weeds),
    ],
  };
}

function yieldSentence(input: SummaryInput, result: YieldResult, referenceName: string, marginText: string): string {
  const name = nameOf(input, result.code);
  const range = result.differenceRange ? `${number(result.differenceRange.low, 1)} to ${number(result.differenceRange.high, 1)} t/ha` : null;
  if (result.equivalent === true) {
    return `${name}: yield similar to ${referenceName}, at ${yieldBoth(result.mean)}; an equivalence test placed the difference within ${marginText}.`;
  }
  if (result.detected) {
    const direction = result.difference < 0 ? "less" : "more";
    return `${name} yielded ${yieldBoth(Math.abs(result.difference))} ${direction} than ${referenceName}${range ? ` (range of the difference ${range})` : ""}.`;
  }
  const equivalence = result.equivalent === false ? ` Nor could the trial show that its yield is within ${marginText}.` : "";
  return `${name}: no clear difference in yield from ${referenceName} in this trial, at ${yieldBoth(result.mean)}${range ? ` (range of the difference ${range})` : ""}.${equivalence}`;
}

function yieldSection(input: SummaryInput): SummarySection | null {
  const found = input.yield;
  if (!found) return null;
  const referenceName = found.reference.kind === "hand" ? nameOf(input, found.reference.code).toLowerCase() : "the weed-free check";
  const marginText = `±${number(found.marginShare * 100, 0)}% of the yield of ${referenceName} (±${number(found.margin, 2)} t/ha)`;
  const order = input.methods.filter((method) => method.code !== found.reference.code && method.checkType !== "weed-free").map((method) => method.code);
  const results = found.results.filter((result) => order.includes(result.code)).sort((a, b) => order.indexOf(a.code) - order.indexOf(b.code));
  return {
    key: "yield",
    heading: "Crop yield",
    paragraphs: [
      `Yield is compared with ${referenceName}, which gave ${yieldBoth(found.reference.mean)}.`,
      ...results.map((result) => yieldSentence(input, result, referenceName, marginText)),
    ],
  };
}

function costsSection(input: SummaryInput): SummarySection | null {
  const costs = comparedMethods(input)
    .map((method) => ({ method, cost: input.costs.find((cost) => cost.code === method.code) }))
    .filter((entry) => entry.cost !== undefined);
  if (costs.length === 0) return null;
  return {
    key: "costs",
    heading: "Cost and labour",
    paragraphs: [
      ...costs.map(({ method, cost }) => {
        if (cost!.incomplete && cost!.totalPerHa === 0) return `The trial did not record what ${method.name.toLowerCase()} cost.`;
        const incomplete = cost!.incomplete ? " Some costs were not recorded, so the full cost is higher." : "";
        return `${method.name} cost about ${moneyPerAreaBoth(cost!.totalPerHa, input.currency)} for the season, including ${hoursPerAreaBoth(cost!.labourHoursPerHa)} of labour.${incomplete}`;
      }),
      `Labour is costed at ${money(input.labourRatePerHour, input.currency)} an hour, an assumption you can change; equipment is spread over its useful life.`,
    ],
  };
}

/** Where the results come from and that they are not a recommendation; the technical report prints the same words. */
export function scopeCaveat(sites: number, siteName: string, season: string): string {
  return sites === 1
    ? `These results are from one trial at one site in one season (${siteName}, ${season}). Weeds, soil and weather differ between farms and years, so treat them as one piece of evidence, not a recommendation.`
    : `These results come from ${sites} sites in one season. They are stronger evidence than a single trial, but weeds, soil and weather still differ between farms and years; they are not a recommendation.`;
}

function caveatsSection(input: SummaryInput): SummarySection {
  const hazardous = comparedMethods(input).filter((method) => cautionsFor(method.category).length > 0);
  const paragraphs: string[] = [];
  paragraphs.push(scopeCaveat(input.sites, input.trial.siteName, input.trial.season));
  if (hazardous.length > 0) {
    paragraphs.push(
      `${list(hazardous.map((method) => method.name))} ${hazardous.length === 1 ? "carries" : "carry"} safety risks; read the cautions below. The product label and local regulations govern, not this summary.`,
    );
  }
  return { key: "caveats", heading: "Before you decide", paragraphs };
}

export function generateSummary(input: SummaryInput): GeneratedSummary {
  const sections = [comparedSection(input), whereSection(input), weedsSection(input), yieldSection(input), costsSection(input), caveatsSection(input)].filter(
    (section): section is SummarySection => section !== null,
  );
  if (!input.weeds && !input.yield) {
    sections.splice(2, 0, { key: "weeds", heading: "Results", paragraphs: ["The trial's results are not available yet."] });
  }
  return { sections, text: summaryText(sections) };
}

export function summaryText(sections: SummarySection[]): string {
  return sections.map((section) => [`## ${section.heading}`, ...section.paragraphs].join("\n\n")).join("\n\n");
}

/** The stored text back into headed sections for display; "## " starts a heading. */
export function parseSummaryText(text: string): Array<{ heading: string | null; paragraphs: string[] }> {
  const blocks = text.replace(/\r\n/g, "\n").split(/\n\s*\n/).map((block) => block.trim()).filter(Boolean);
  const parsed: Array<{ heading: string | null; paragraphs: string[] }> = [];
  for (const block of blocks) {
    if (block.startsWith("## ")) parsed.push({ heading: block.slice(3).trim(), paragraphs: [] });
    else {
      if (parsed.length === 0) parsed.push({ heading: null, paragraphs: [] });
      parsed[parsed.length - 1].paragraphs.push(block);
    }
  }
  return parsed;
}
