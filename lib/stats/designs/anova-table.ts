import { fCdf } from "../distributions/f-cdf";
import type { AnovaRow } from "./model-types";

/** A term's df and SS, and optionally the term it is tested against (default: residual). */
export interface AnovaTerm {
  source: string;
  df: number;
  ss: number;
  testedAgainst?: string;
}

/**
 * Completes an ANOVA table: mean squares MS = SS/df, F = MS / MS(error term)
 * and p = P(F(df, df_error) > F) from the upper tail computed directly.
 *
 * Why the error term is per row: in a combined analysis over sites,
 * treatment is tested against site:treatment and site against block(site)
 * (sites random), the rest against the residual.
 *
 * Reference: Steel, R. G. D., Torrie, J. H. & Dickey, D. A. (1997)
 * Principles and Procedures of Statistics, 3rd ed., ch. 7 and 9.
 *
 * @example
 * anovaTable([{ source: "treatment", df: 2, ss: 10 }], 6, 3)
 * // [{ source: "treatment", df: 2, ss: 10, ms: 5, f: 10, p: 0.012289485662266697 },
 * //  { source: "residual", df: 6, ss: 3, ms: 0.5 }]
 */
export function anovaTable(terms: AnovaTerm[], dfResidual: number, sumOfSquaresResidual: number): AnovaRow[] {
  const meanSquareResidual = sumOfSquaresResidual / dfResidual;
  const meanSquareOf = new Map<string, { df: number; ms: number }>();
  for (const term of terms) meanSquareOf.set(term.source, { df: term.df, ms: term.ss / term.df });
  const rows: AnovaRow[] = terms.map((term) => {
    const meanSquare = term.ss / term.df;
    const error = term.testedAgainst ? meanSquareOf.get(term.testedAgainst) : undefined;
    const errorMeanSquare = error ? error.ms : meanSquareResidual;
    const errorDf = error ? error.df : dfResidual;
    const f = meanSquare / errorMeanSquare;
    return { source: term.source, df: term.df, ss: term.ss, ms: meanSquare, f, p: fCdf(f, term.df, errorDf).upper };
  });
  rows.push({ source: "residual", df: dfResidual, ss: sumOfSquaresResidual, ms: meanSquareResidual });
  return rows;
}
