/**
 * Confidence interval for the noncentrality λ of a chi-square statistic by inverting the
 * noncentral distribution (Steiger & Fouladi 1997, "Noncentrality interval estimation and the
 * evaluation of statistical models", in Harlow, Mulaik & Steiger, What If There Were No
 * Significance Tests?): with γ = (1 − level)/2, the limits solve P(X > x_obs; λ_low) = γ and
 * P(X <= x_obs; λ_high) = γ, each set to 0 when even λ = 0 cannot reach that probability.
 */
import { noncentralChiSquareTails } from '../distributions/noncentral-chi-square';
import { findRoot } from '../optimize/find-root';

function bracketAbove(f: (lambda: number) => number, start: number): number {
  let high = Math.max(start, 1);
  while (f(high) > 0) high *= 2;
  return high;
}

export function noncentralityInterval(statistic: number, df: number, level: number): { low: number; high: number } {
  const gamma = (1 - level) / 2;
  // Upper limit: the lower tail at x_obs falls as λ grows; find where it equals γ.
  const lowerTailExcess = (lambda: number) => noncentralChiSquareTails(statistic, df, lambda).lower - gamma;
  const high =
    lowerTailExcess(0) <= 0 ? 0 : findRoot(lowerTailExcess, 0, bracketAbove(lowerTailExcess, statistic), 1e-10);
  // Lower limit: the upper tail at x_obs rises with λ; find where it equals γ.
  const upperTailShortfall = (lambda: number) => gamma - noncentralChiSquareTails(statistic, df, lambda).upper;
  const low =
    upperTailShortfall(0) <= 0 ? 0 : findRoot(upperTailShortfall, 0, bracketAbove(upperTailShortfall, statistic), 1e-10);
  return { low, high };
}
