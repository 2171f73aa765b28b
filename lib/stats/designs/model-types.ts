import type { EncodedFactor } from "../core/encode-factor";

/** One line of an analysis-of-variance table. The residual line has no F or p. */
export interface AnovaRow {
  source: string;
  df: number;
  ss: number;
  ms: number;
  f?: number;
  p?: number;
}

/**
 * What every design returns: the ANOVA table, residuals and the treatment
 * least-squares means with their unscaled covariance, so that mean
 * separation, equivalence and letters work the same for all designs.
 */
export interface ModelFit {
  anova: AnovaRow[];
  residuals: Float64Array;
  dfResidual: number;
  meanSquareResidual: number;
  treatment: EncodedFactor;
  /** Least-squares means on the analysed scale minus the response offset. */
  lsmeans: Float64Array;
  /** k × k row-major matrix C with Var(lsmeans) = errorMeanSquare · C. */
  lsmeanCovariance: Float64Array;
  /** Mean square and df that treatment comparisons use (site:treatment when sites are combined). */
  errorMeanSquare: number;
  errorDf: number;
  /** True when the closed-form balanced computation applied. */
  balanced: boolean;
}

/** A model term for the general least-squares fit: the factors whose level combinations it indexes. */
export interface ModelTerm {
  source: string;
  factors: EncodedFactor[];
}
