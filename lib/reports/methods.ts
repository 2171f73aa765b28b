import { transformLabels, type AnalysisOptions } from "@/lib/validations/analysis";

const designText: Record<string, string> = {
  rcbd: "a randomized complete block design",
  crd: "a completely randomized design",
  latin: "a Latin square design",
};

/** The methods paragraph, written from the settings the report's analyses actually used. */
export function methodsParagraph(input: { design: string; blocks: number; treatments: number; quadratAreaM2: number; options: AnalysisOptions; control: string | null; version: string; anyUnbalanced: boolean }): string {
  const { options } = input;
  const sentences = [
    `The trial was laid out as ${designText[input.design] ?? input.design} with ${input.treatments} treatments and ${input.blocks} ${input.design === "crd" ? "replicates" : "blocks"}.`,
    `Weed counts and weights were taken in ${input.quadratAreaM2} m² quadrats and expressed per m²; yields per plot were expressed per hectare.`,
    options.transform === "none"
      ? "Plot values were analysed untransformed by analysis of variance"
      : `Plot values were transformed (${transformLabels[options.transform]}) before analysis of variance, and means are shown back-transformed`,
  ];
  sentences[2] += input.design === "rcbd" ? " with blocks and treatments as fixed effects." : ".";
  if (input.anyUnbalanced) sentences.push("Where plots were lost, the model was fitted by least squares and treatment means are least-squares means.");
  sentences.push(
    options.method === "tukey"
      ? `Means were separated with Tukey's honestly significant difference (Tukey-Kramer for unequal replication) at α = ${options.alpha}.`
      : `Means were separated with Fisher's protected least significant difference at α = ${options.alpha}, only when the treatment F test was significant at that level.`,
  );
  sentences.push("Normality of residuals was checked with the Shapiro-Wilk test and homogeneity of variances with the Brown-Forsythe (Levene) test.");
  if (input.control) sentences.push(`Percent control was calculated against the ${input.control} treatment from untransformed means.`);
  if (options.reference && options.margin) sentences.push(`Equivalence to ${options.reference} was tested with two one-sided t-tests (90% confidence interval) and a margin of ±${options.margin}.`);
  sentences.push(`All analyses were run with Hoebench ${input.version}.`);
  return sentences.join(" ");
}
