/** Outcome of the residual degrees-of-freedom check. */
export interface ResidualDfCheck {
  dfResidual: number;
  adequate: boolean;
  message: string;
}

/**
 * Checks that a trial leaves enough residual degrees of freedom to estimate
 * the error variance reliably.
 *
 * Formula: adequate when df_residual >= 12. Below that the t and F critical
 * values grow quickly (t(0.975; 6) = 2.45 against 2.18 at 12 df), so real
 * differences are missed.
 *
 * Assumptions: the threshold is common practice in efficacy trials, following
 * the EPPO guidance on design and analysis of efficacy evaluation trials,
 * which asks for enough replicates and treatments to give at least 12
 * residual df; it is a rule of thumb, not a statistical law.
 *
 * Reference: EPPO Standard PP 1/152 Design and analysis of efficacy
 * evaluation trials.
 *
 * @example
 * residualDfCheck(9).adequate // false
 */
export function residualDfCheck(dfResidual: number): ResidualDfCheck {
  const adequate = dfResidual >= 12;
  return {
    dfResidual,
    adequate,
    message: adequate
      ? `${dfResidual} residual degrees of freedom (at least 12, common practice after EPPO PP 1/152).`
      : `Only ${dfResidual} residual degrees of freedom; common practice (EPPO PP 1/152) asks for at least 12: add blocks or treatments.`,
  };
}
