import type { ResponseTransform } from "../core/transform-value";

/** What the advice looks at. Group means and variances are on the untransformed scale. */
export interface AssumptionEvidence {
  rawValues: ArrayLike<number>;
  groupMeans: ArrayLike<number>;
  groupVariances: ArrayLike<number>;
  shapiroP: number | null;
  leveneP: number | null;
  alpha: number;
  transform: ResponseTransform;
  design: string;
}

/**
 * Plain-language advice on the ANOVA assumptions, for researchers who are
 * not statisticians.
 *
 * Formula: Taylor's power law, log s²_j = log a + b log ȳ_j fitted across
 * treatments on the raw scale; b near 1 (variance ∝ mean, Poisson-like
 * counts) suggests √y, b near 2 or more (sd ∝ mean) suggests log(y + 1), the
 * power transformation y^(1 - b/2) being the rule. Percentages in 0-100
 * with heterogeneous variances suggest asin √(y/100). Non-normal residuals
 * (Shapiro-Wilk p < α) suggest a transformation or a rank test: Friedman for
 * complete blocks, Kruskal-Wallis for completely randomized designs (both
 * reported by analyzeTrial).
 *
 * Assumptions: advisory only; never changes the analysis.
 *
 * Reference: Taylor, L. R. (1961) Aggregation, variance and the mean. Nature
 * 189:732-735; Gomez & Gomez (1984) §7.2.2 (choice of transformation).
 *
 * @example
 * assumptionAdvice({ rawValues: [1, 3, 2, 8, 6, 9, 25, 33, 31], groupMeans: [2, 8, 30], groupVariances: [2, 9, 33],
 *   shapiroP: 0.01, leveneP: 0.004, alpha: 0.05, transform: "none", design: "crd" })
 * // ["Variances differ between treatments (Brown-Forsythe p = 0.004).",
 * //  "Residuals depart from a normal distribution (Shapiro-Wilk p = 0.010).",
 * //  "The variance rises in proportion to the mean, as for counts: analyse √y (--transform sqrt).",
 * //  "If a transformation does not help, the Kruskal-Wallis rank test (reported) does not assume normality."]
 */
export function assumptionAdvice(evidence: AssumptionEvidence): string[] {
  const advice: string[] = [];
  const { alpha, transform } = evidence;
  const nonNormal = evidence.shapiroP !== null && evidence.shapiroP < alpha;
  const unequalVariances = evidence.leveneP !== null && evidence.leveneP < alpha;
  if (unequalVariances) advice.push(`Variances differ between treatments (Brown-Forsythe p = ${formatP(evidence.leveneP as number)}).`);
  if (nonNormal) advice.push(`Residuals depart from a normal distribution (Shapiro-Wilk p = ${formatP(evidence.shapiroP as number)}).`);
  if (transform === "none" && (nonNormal || unequalVariances)) {
    const values = Array.from(evidence.rawValues);
    const counts = values.every((value) => value >= 0 && Number.isInteger(value));
    const percentages = values.every((value) => value >= 0 && value <= 100) && values.some((value) => value < 20 || value > 80);
    const slope = powerLawSlope(evidence.groupMeans, evidence.groupVariances);
    if (slope !== null && slope > 0.5 && slope < 1.5) {
      advice.push("The variance rises in proportion to the mean, as for counts: analyse √y (--transform sqrt).");
    } else if (slope !== null && slope >= 1.5) {
      advice.push("The standard deviation rises with the mean: analyse log(y + 1) (--transform log1p).");
    } else if (percentages && !counts) {
      advice.push("Percentages near 0 or 100 have smaller variances: analyse asin √(y/100) (--transform asin-sqrt).");
    } else if (counts) {
      advice.push("Counts usually need √y or log(y + 1) (--transform sqrt or log1p).");
    }
  }
  if (nonNormal) {
    advice.push(
      evidence.design === "rcbd"
        ? "If a transformation does not help, the Friedman rank test (reported) does not assume normality."
        : evidence.design === "crd"
          ? "If a transformation does not help, the Kruskal-Wallis rank test (reported) does not assume normality."
          : "If a transformation does not help, use a rank-based test such as Kruskal-Wallis.",
    );
  }
  if (!nonNormal && !unequalVariances) advice.push("Residuals look normal and variances similar: the ANOVA assumptions are reasonable.");
  return advice;
}

function powerLawSlope(means: ArrayLike<number>, variances: ArrayLike<number>): number | null {
  const points: Array<[number, number]> = [];
  for (let index = 0; index < means.length; index++) {
    if (means[index] > 0 && variances[index] > 0) points.push([Math.log(means[index]), Math.log(variances[index])]);
  }
  if (points.length < 3) return null;
  const meanX = points.reduce((sum, point) => sum + point[0], 0) / points.length;
  const meanY = points.reduce((sum, point) => sum + point[1], 0) / points.length;
  let cross = 0;
  let spread = 0;
  for (const [x, y] of points) {
    cross += (x - meanX) * (y - meanY);
    spread += (x - meanX) ** 2;
  }
  return spread > 0 ? cross / spread : null;
}

function formatP(p: number): string {
  return p < 0.001 ? p.toExponential(1) : p.toFixed(3);
}
