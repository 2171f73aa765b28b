import { StatsInputError } from "../errors";
import { NeumaierAccumulator } from "../core/neumaier-accumulator";
import { compensatedSum } from "../core/compensated-sum";
import type { EncodedFactor } from "../core/encode-factor";
import { anovaTable, type AnovaTerm } from "./anova-table";
import { fitLinearModel } from "./fit-linear-model";
import { groupMeans } from "./group-means";
import { leastSquaresMeans, type GridPoint } from "./least-squares-means";
import type { ModelFit } from "./model-types";

/**
 * Randomized complete blocks combined over sites:
 * response = site + block(site) + treatment + site:treatment.
 *
 * Formula (balanced, s sites × r blocks × t treatments):
 * SS_site = t r Σ (ȳ_s - ȳ)², SS_block(site) = t Σ (ȳ_sb - ȳ_s)²,
 * SS_treatment = s r Σ (ȳ_j - ȳ)², SS_site:treatment = r Σ (ȳ_sj - ȳ_s - ȳ_j + ȳ)²,
 * e = y - ȳ_sj - ȳ_sb + ȳ_s. With sites random, treatment is tested against
 * site:treatment and site against block(site); treatment means are compared
 * with the site:treatment mean square, Var(ȳ_j) = MS_site:treatment / (s r).
 * Unbalanced data (lost plots): sequential least squares in the order above;
 * lsmeans average over sites and their blocks; their variance uses the
 * fixed-model (X'X)⁻¹ scaled by MS_site:treatment, which reduces to the
 * balanced formula exactly (a mixed-model REML fit would differ slightly).
 *
 * Assumptions: blocks are nested in sites (block "1" at two sites are two
 * blocks); every site × treatment combination observed.
 *
 * Reference: Gomez & Gomez (1984) §8.1 (combined analysis over locations);
 * McIntosh, M. S. (1983) Analysis of combined experiments. Agronomy Journal
 * 75:153-155.
 *
 * @example
 * // 2 sites × 2 blocks × 2 treatments; block "1" at S1 and at S2 are different blocks
 * fitCombinedSites(
 *   new Float64Array([10, 12, 11, 14, 7, 8, 9, 11]),
 *   encodeFactor(["a", "b", "a", "b", "a", "b", "a", "b"]),
 *   encodeFactor(["1", "1", "2", "2", "1", "1", "2", "2"]),
 *   encodeFactor(["S1", "S1", "S1", "S1", "S2", "S2", "S2", "S2"]),
 * ).anova.map((row) => [row.source, row.ss, row.f])
 * // [["site", 18, 4.235294117647059], ["block(site)", 8.5, 17], ["treatment", 8, 16],
 * //  ["site:treatment", 0.5, 2], ["residual", 0.5, undefined]]
 * // R anova(lm(terms(y ~ site + site:block + trt + site:trt, keep.order = TRUE))) has the same SS
 * // (18, 8.5, 8, 0.5, 0.5); its F for site (72) and treatment (32) divide by the residual mean
 * // square, ours by block(site) (18 / 4.25) and site:treatment (8 / 0.5) as sites are random.
 */
export function fitCombinedSites(
  response: Float64Array,
  treatment: EncodedFactor,
  block: EncodedFactor,
  site: EncodedFactor,
): ModelFit {
  const treatmentCount = treatment.levels.length;
  const siteCount = site.levels.length;
  if (treatmentCount < 2) throw new StatsInputError("anova requires at least two treatments");
  if (siteCount < 2) throw new StatsInputError("combined analysis requires at least two sites");
  const observations = response.length;
  const blockWithinSite = nestedBlocks(block, site);
  const blockCount = blockWithinSite.factor.levels.length;
  const blocksPerSite = new Int32Array(siteCount);
  for (const siteLevel of blockWithinSite.siteOfBlock) blocksPerSite[siteLevel] += 1;
  const cellCounts = new Int32Array(blockCount * treatmentCount);
  for (let index = 0; index < observations; index++) {
    cellCounts[blockWithinSite.factor.codes[index] * treatmentCount + treatment.codes[index]] += 1;
  }
  const balanced = cellCounts.every((count) => count === 1) && blocksPerSite.every((count) => count === blocksPerSite[0]);
  if (balanced && blocksPerSite[0] >= 2) {
    return balancedSites(response, treatment, site, blockWithinSite.factor, blockWithinSite.siteOfBlock);
  }

  const fit = fitLinearModel(response, [
    { source: "site", factors: [site] },
    { source: "block(site)", factors: [blockWithinSite.factor] },
    { source: "treatment", factors: [treatment] },
    { source: "site:treatment", factors: [site, treatment] },
  ]);
  if (fit.dfResidual < 1) throw new StatsInputError("anova requires residual degrees of freedom (more plots than model parameters)");
  const terms: AnovaTerm[] = fit.terms.map((term) => ({
    ...term,
    testedAgainst: term.source === "site" ? "block(site)" : term.source === "treatment" ? "site:treatment" : undefined,
  }));
  const interaction = terms[3];
  if (interaction.df < 1) throw new StatsInputError("combined analysis requires site:treatment degrees of freedom");
  const anova = anovaTable(terms, fit.dfResidual, fit.sumOfSquaresResidual);
  const grid: GridPoint[] = [];
  blockWithinSite.siteOfBlock.forEach((siteLevel, blockLevel) => {
    grid.push({
      levels: new Map([
        [site, siteLevel],
        [blockWithinSite.factor, blockLevel],
      ]),
      weight: 1 / (siteCount * blocksPerSite[siteLevel]),
    });
  });
  const { lsmeans, covariance } = leastSquaresMeans(fit, treatment, grid);
  return {
    anova,
    residuals: fit.residuals,
    dfResidual: fit.dfResidual,
    meanSquareResidual: anova[anova.length - 1].ms,
    treatment,
    lsmeans,
    lsmeanCovariance: covariance,
    errorMeanSquare: interaction.ss / interaction.df,
    errorDf: interaction.df,
    balanced: false,
  };
}

function nestedBlocks(block: EncodedFactor, site: EncodedFactor): { factor: EncodedFactor; siteOfBlock: number[] } {
  const blockLevelCount = block.levels.length;
  const indexOfPair = new Map<number, number>();
  const levels: string[] = [];
  const siteOfBlock: number[] = [];
  const pairs = Array.from(new Set(Array.from(site.codes, (siteLevel, index) => siteLevel * blockLevelCount + block.codes[index]))).sort(
    (first, second) => first - second,
  );
  for (const pair of pairs) {
    indexOfPair.set(pair, levels.length);
    const siteLevel = Math.floor(pair / blockLevelCount);
    levels.push(`${site.levels[siteLevel]}/${block.levels[pair % blockLevelCount]}`);
    siteOfBlock.push(siteLevel);
  }
  const codes = new Int32Array(block.codes.length);
  for (let index = 0; index < codes.length; index++) {
    codes[index] = indexOfPair.get(site.codes[index] * blockLevelCount + block.codes[index]) as number;
  }
  return { factor: { levels, codes }, siteOfBlock };
}

function balancedSites(
  response: Float64Array,
  treatment: EncodedFactor,
  site: EncodedFactor,
  blockWithinSite: EncodedFactor,
  siteOfBlock: number[],
): ModelFit {
  const treatmentCount = treatment.levels.length;
  const siteCount = site.levels.length;
  const blocksPerSite = blockWithinSite.levels.length / siteCount;
  const observations = response.length;
  const grandMean = compensatedSum(response) / observations;
  const siteMeans = groupMeans(response, site.codes, siteCount).means;
  const blockMeans = groupMeans(response, blockWithinSite.codes, blockWithinSite.levels.length).means;
  const treatmentMeans = groupMeans(response, treatment.codes, treatmentCount).means;
  const cellCodes = new Int32Array(observations);
  for (let index = 0; index < observations; index++) cellCodes[index] = site.codes[index] * treatmentCount + treatment.codes[index];
  const cellMeans = groupMeans(response, cellCodes, siteCount * treatmentCount).means;

  const siteSum = new NeumaierAccumulator();
  for (const mean of siteMeans) siteSum.add((mean - grandMean) ** 2);
  const blockSum = new NeumaierAccumulator();
  blockMeans.forEach((mean, blockLevel) => blockSum.add((mean - siteMeans[siteOfBlock[blockLevel]]) ** 2));
  const treatmentSum = new NeumaierAccumulator();
  for (const mean of treatmentMeans) treatmentSum.add((mean - grandMean) ** 2);
  const interactionSum = new NeumaierAccumulator();
  for (let siteLevel = 0; siteLevel < siteCount; siteLevel++) {
    for (let level = 0; level < treatmentCount; level++) {
      const deviation = cellMeans[siteLevel * treatmentCount + level] - siteMeans[siteLevel] - treatmentMeans[level] + grandMean;
      interactionSum.add(deviation * deviation);
    }
  }
  const residuals = new Float64Array(observations);
  const residualSum = new NeumaierAccumulator();
  for (let index = 0; index < observations; index++) {
    const residual =
      response[index] - cellMeans[cellCodes[index]] - blockMeans[blockWithinSite.codes[index]] + siteMeans[site.codes[index]];
    residuals[index] = residual;
    residualSum.add(residual * residual);
  }
  const dfInteraction = (siteCount - 1) * (treatmentCount - 1);
  const anova = anovaTable(
    [
      { source: "site", df: siteCount - 1, ss: treatmentCount * blocksPerSite * siteSum.value(), testedAgainst: "block(site)" },
      { source: "block(site)", df: siteCount * (blocksPerSite - 1), ss: treatmentCount * blockSum.value() },
      { source: "treatment", df: treatmentCount - 1, ss: siteCount * blocksPerSite * treatmentSum.value(), testedAgainst: "site:treatment" },
      { source: "site:treatment", df: dfInteraction, ss: blocksPerSite * interactionSum.value() },
    ],
    siteCount * (blocksPerSite - 1) * (treatmentCount - 1),
    residualSum.value(),
  );
  const lsmeanCovariance = new Float64Array(treatmentCount * treatmentCount);
  for (let level = 0; level < treatmentCount; level++) {
    lsmeanCovariance[level * treatmentCount + level] = 1 / (siteCount * blocksPerSite);
  }
  return {
    anova,
    residuals,
    dfResidual: anova[anova.length - 1].df,
    meanSquareResidual: anova[anova.length - 1].ms,
    treatment,
    lsmeans: treatmentMeans,
    lsmeanCovariance,
    errorMeanSquare: anova[3].ms,
    errorDf: dfInteraction,
    balanced: true,
  };
}
