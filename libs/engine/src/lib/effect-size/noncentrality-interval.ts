/**
 * Confidence interval for the noncentrality λ of a chi-square statistic by inverting the
 * noncentral distribution (Steiger & Fouladi 1997, "Noncentrality interval estimation and the
 * evaluation of statistical models", in Harlow, Mulaik & Steiger, What If There Were No
 * Significance Tests?): with γ = (1 − level)/2, the limits solve P(X > x_obs; λ_low) = γ and
 * P(X <= x_obs; λ_high) = γ, each set to 0 when even λ = 0 cannot reach that probability.
 */
import { noncentralChiSquareTail } from '../distributions/noncentral-chi-square';
import { findRoot } from '../optimize/find-root';

/**
 * A bracket [low, high] around the root of an increasing function f of λ, started from the normal
 * approximation of χ²(df, λ) (mean df + λ, variance 2(df + 2λ)) so that the root finder needs few
 * evaluations even when λ is in the millions; widened until the signs differ.
 */
function bracket(f: (lambda: number) => number, statistic: number, df: number): [number, number] {
  const centre = Math.max(0, statistic - df);
  const spread = Math.sqrt(2 * (df + 2 * centre)) + 1;
  let low = Math.max(0, centre - 4 * spread);
  let high = centre + 4 * spread;
  let width = 4 * spread;
  while (low > 0 && f(low) > 0) {
    width *= 2;
    low = Math.max(0, centre - width);
  }
  width = 4 * spread;
  while (f(high) < 0) {
    width *= 2;
    high = centre + width;
  }
  return [low, high];
}

export function noncentralityInterval(statistic: number, df: number, level: number): { low: number; high: number } {
  const gamma = (1 - level) / 2;
  // Upper limit: the lower tail at x_obs falls as λ grows; find where it equals γ.
  const lowerTailShortfall = (lambda: number) => gamma - noncentralChiSquareTail(statistic, df, lambda, 'lower');
  const high = lowerTailShortfall(0) >= 0 ? 0 : findRoot(lowerTailShortfall, ...bracket(lowerTailShortfall, statistic, df), 1e-10);
  // Lower limit: the upper tail at x_obs rises with λ; find where it equals γ.
  const upperTailExcess = (lambda: number) => noncentralChiSquareTail(statistic, df, lambda, 'upper') - gamma;
  const low = upperTailExcess(0) >= 0 ? 0 : findRoot(upperTailExcess, ...bracket(upperTailExcess, statistic, df), 1e-10);
  return { low, high };
}
