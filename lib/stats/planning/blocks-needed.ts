import { StatsInputError } from "../errors";
import { fQuantile } from "../distributions/f-quantile";
import { noncentralFCdf } from "../distributions/noncentral-f-cdf";
import { residualDfCheck, type ResidualDfCheck } from "./residual-df-check";

/** What to detect and with which certainty. */
export interface BlocksNeededInput {
  treatments: number;
  /** Expected coefficient of variation of plot values, in percent. */
  cvPercent: number;
  /** Smallest difference between two treatment means worth detecting. */
  difference: number;
  /** "percent": difference is a % of the trial mean; "absolute": in response units (then give mean). */
  differenceKind: "percent" | "absolute";
  mean?: number;
  alpha?: number;
  power?: number;
  maximumBlocks?: number;
}

/** The smallest number of blocks reaching the power, with the figures behind it. */
export interface BlocksNeededResult {
  blocks: number;
  power: number;
  dfTreatment: number;
  dfResidual: number;
  noncentrality: number;
  criticalF: number;
  residualDf: ResidualDfCheck;
}

/**
 * Number of blocks (replicates) an RCBD needs so that the treatment F test
 * detects a given difference between two treatments with the desired power.
 *
 * Formula: with b blocks and t treatments, df = (t - 1, (t - 1)(b - 1)); the
 * least favourable configuration (two means δ apart, the others midway) has
 * noncentrality λ = b δ² / (2σ²) where δ/σ = difference% / CV%;
 * power = P(F'(df1, df2, λ) > F(1 - α; df1, df2)). b increases from 2 until
 * the power is reached. The result also reports whether the residual df
 * reach 12 (common practice after EPPO PP 1/152).
 *
 * Assumptions: normal errors with the stated CV; one plot per treatment and
 * block.
 *
 * Reference: Cohen, J. (1988) Statistical Power Analysis for the Behavioral
 * Sciences, 2nd ed., ch. 8; Lenth (1987) AS 226 for the noncentral
 * distribution; EPPO Standard PP 1/152.
 *
 * @example
 * blocksNeeded({ treatments: 6, cvPercent: 15, difference: 30, differenceKind: "percent" }).blocks // 8 (power 0.8291005120941988)
 */
export function blocksNeeded(input: BlocksNeededInput): BlocksNeededResult {
  const { treatments, cvPercent, difference, differenceKind } = input;
  const alpha = input.alpha ?? 0.05;
  const targetPower = input.power ?? 0.8;
  const maximumBlocks = input.maximumBlocks ?? 200;
  if (!(treatments >= 2)) throw new StatsInputError("planning requires at least two treatments");
  if (!(cvPercent > 0)) throw new StatsInputError("planning requires an expected CV% above zero");
  if (!(difference > 0)) throw new StatsInputError("planning requires a difference above zero");
  if (!(alpha > 0 && alpha < 1) || !(targetPower > 0 && targetPower < 1)) throw new StatsInputError("planning requires alpha and power between 0 and 1");
  let relativeDifference = difference;
  if (differenceKind === "absolute") {
    if (!(input.mean !== undefined && input.mean > 0)) throw new StatsInputError("planning requires the expected mean when the difference is absolute");
    relativeDifference = (100 * difference) / input.mean;
  }
  const standardizedSquared = (relativeDifference / cvPercent) ** 2;
  const dfTreatment = treatments - 1;
  let last: BlocksNeededResult | undefined;
  for (let blocks = 2; blocks <= maximumBlocks; blocks++) {
    const dfResidual = dfTreatment * (blocks - 1);
    const noncentrality = (blocks * standardizedSquared) / 2;
    const criticalF = fQuantile(alpha, dfTreatment, dfResidual);
    const power = noncentralFCdf(criticalF, dfTreatment, dfResidual, noncentrality).upper;
    last = { blocks, power, dfTreatment, dfResidual, noncentrality, criticalF, residualDf: residualDfCheck(dfResidual) };
    if (power >= targetPower) return last;
  }
  throw new StatsInputError(`planning requires more than ${maximumBlocks} blocks for this difference (power ${last?.power.toFixed(3)})`);
}
