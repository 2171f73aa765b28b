import { StatsInputError } from "../errors";
import type { ModelFit } from "../designs/model-types";
import { studentTCdf } from "../distributions/student-t-cdf";
import { studentTQuantile } from "../distributions/student-t-quantile";

/** TOST outcome for one treatment against the reference. */
export interface EquivalenceResult {
  treatment: string;
  reference: string;
  diff: number;
  se: number;
  ci90: [number, number];
  pLower: number;
  pUpper: number;
  p: number;
  equivalent: boolean;
}

/**
 * Two one-sided t-tests (TOST) of equivalence of each treatment to a
 * reference within ±margin, on lsmean differences.
 *
 * Formula: d = m_t - m_ref, SE from the model (MS_error, lsmean covariance),
 * p₁ = P(T_df > (d + margin)/SE) for H₀: d <= -margin,
 * p₂ = P(T_df < (d - margin)/SE) for H₀: d >= margin; p = max(p₁, p₂);
 * the matching interval is d ± t(1-α; df)·SE (90% when α = 0.05);
 * equivalent when p < α, i.e. the interval lies inside (-margin, margin).
 *
 * Assumptions: margin > 0 on the analysed scale; MS_error and df are the
 * model's residual ones (site:treatment for combined sites).
 *
 * Reference: Schuirmann, D. J. (1987) A comparison of the two one-sided tests
 * procedure and the power approach for assessing the equivalence of average
 * bioavailability. J. Pharmacokinet. Biopharm. 15:657-680.
 *
 * @example
 * equivalenceTost(hardnessFit, "tip1", 0.2, 0.05)[0]
 * // { treatment: "tip2", reference: "tip1", diff: 0.02500000000000213, se: 0.06666666666666676,
 * //   ci90: [-0.09720752884374728, 0.14720752884375155], pLower: 0.004095855281975638,
 * //   pUpper: 0.013791931015468014, p: 0.013791931015468014, equivalent: true }
 */
export function equivalenceTost(fit: ModelFit, reference: string, margin: number, alpha: number): EquivalenceResult[] {
  if (!(margin > 0)) throw new StatsInputError("equivalence test requires a positive margin");
  const levels = fit.treatment.levels;
  const referenceIndex = levels.indexOf(reference);
  if (referenceIndex < 0) throw new StatsInputError(`equivalence test requires the reference "${reference}" to be a treatment level`);
  const count = levels.length;
  const criticalValue = studentTQuantile(1 - alpha, fit.errorDf);
  const results: EquivalenceResult[] = [];
  for (let level = 0; level < count; level++) {
    if (level === referenceIndex) continue;
    const diff = fit.lsmeans[level] - fit.lsmeans[referenceIndex];
    const varianceFactor =
      fit.lsmeanCovariance[level * count + level] +
      fit.lsmeanCovariance[referenceIndex * count + referenceIndex] -
      2 * fit.lsmeanCovariance[level * count + referenceIndex];
    const se = Math.sqrt(fit.errorMeanSquare * varianceFactor);
    const pLower = studentTCdf((diff + margin) / se, fit.errorDf).upper;
    const pUpper = studentTCdf((diff - margin) / se, fit.errorDf).lower;
    const p = Math.max(pLower, pUpper);
    results.push({
      treatment: levels[level],
      reference,
      diff,
      se,
      ci90: [diff - criticalValue * se, diff + criticalValue * se],
      pLower,
      pUpper,
      p,
      equivalent: p < alpha,
    });
  }
  return results;
}
