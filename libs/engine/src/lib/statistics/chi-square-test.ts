import { chiSquareTails } from '../distributions/chi-square';

/** A statistic referred to the chi-square distribution: the shape every asymptotic test result takes. */
export interface ChiSquareTestResult {
  statistic: number;
  df: number;
  p: number;
  /** ln p, finite even where p underflows to 0 */
  logP: number;
}

export function chiSquareTestResult(statistic: number, df: number): ChiSquareTestResult {
  const tails = chiSquareTails(statistic, df);
  return { statistic, df, p: tails.upper, logP: tails.logUpper };
}
