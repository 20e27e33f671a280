/**
 * Confidence interval for the noncentrality λ of a chi-square statistic by inverting the
 * noncentral distribution (Steiger & Fouladi 1997, "Noncentrality interval estimation and the
 * evaluation of statistical models", in Harlow, Mulaik & Steiger, What If There Were No
 * Significance Tests?): with γ = (1 − level)/2, the limits solve P(X > x_obs; λ_low) = γ and
 * P(X <= x_obs; λ_high) = γ, each set to 0 when even λ = 0 cannot reach that probability.
 *
 * Work is bounded whatever the statistic: the noncentral tail costs O(√λ) terms, so beyond
 * LARGE_NONCENTRALITY the limits come from the Cornish–Fisher expansion of the noncentral
 * quantile instead (Cornish & Fisher 1937; cumulants κ_r = 2^{r−1}(r − 1)!(df + rλ), Johnson,
 * Kotz & Balakrishnan 1995, Continuous Univariate Distributions vol. 2, §29.4). There the skewness
 * is below 3/√λ <= 0.003, so the terms left out (of order skewness³) move λ by far less than
 * 1e-9 of itself. Each root search is bracketed and capped in steps.
 */
import { chiSquareQuantile } from '../distributions/chi-square';
import { noncentralChiSquareTail } from '../distributions/noncentral-chi-square';
import { findRoot } from '../optimize/find-root';

export const LARGE_NONCENTRALITY = 1e6;
const ROOT_STEP_LIMIT = 200;
const BRACKET_DOUBLINGS = 60;

/**
 * A bracket [low, high] around the root of an increasing function f of λ, started from the normal
 * approximation of χ²(df, λ) (mean df + λ, variance 2(df + 2λ)) so that the root finder needs few
 * evaluations even when λ is in the millions; widened (a bounded number of times) until the signs differ.
 */
function bracket(f: (lambda: number) => number, statistic: number, df: number): [number, number] {
  const centre = Math.max(0, statistic - df);
  const spread = Math.sqrt(2 * (df + 2 * centre)) + 1;
  let low = Math.max(0, centre - 4 * spread);
  let high = centre + 4 * spread;
  let width = 4 * spread;
  for (let i = 0; i < BRACKET_DOUBLINGS && low > 0 && f(low) > 0; i++) {
    width *= 2;
    low = Math.max(0, centre - width);
  }
  width = 4 * spread;
  for (let i = 0; i < BRACKET_DOUBLINGS && f(high) < 0; i++) {
    width *= 2;
    high = centre + width;
  }
  return [low, high];
}

/** The u-quantile of χ²(df, λ), z = Φ⁻¹(u), to the fourth cumulant (Cornish & Fisher 1937). */
function cornishFisherQuantile(lambda: number, df: number, z: number): number {
  const k2 = 2 * (df + 2 * lambda);
  const k3 = 8 * (df + 3 * lambda);
  const k4 = 48 * (df + 4 * lambda);
  const sd = Math.sqrt(k2);
  const skew = k3 / (sd * k2);
  const kurtosis = k4 / (k2 * k2);
  const z2 = z * z;
  return df + lambda + sd * (z + (skew * (z2 - 1)) / 6 + (kurtosis * z * (z2 - 3)) / 24 - (skew * skew * z * (2 * z2 - 5)) / 36);
}

function largeNoncentralityInterval(statistic: number, df: number, gamma: number): { low: number; high: number } {
  const z = Math.sqrt(chiSquareQuantile(1 - 2 * gamma, 1)); // Φ⁻¹(1 − γ)
  const solve = (zValue: number) => {
    const f = (lambda: number) => cornishFisherQuantile(lambda, df, zValue) - statistic;
    return findRoot(f, ...bracket(f, statistic, df), 1e-13, 1e-300, ROOT_STEP_LIMIT);
  };
  // The statistic is the (1 − γ)-quantile at λ_low and the γ-quantile at λ_high.
  return { low: solve(z), high: solve(-z) };
}

export function noncentralityInterval(statistic: number, df: number, level: number): { low: number; high: number } {
  const gamma = (1 - level) / 2;
  if (statistic - df > LARGE_NONCENTRALITY) return largeNoncentralityInterval(statistic, df, gamma);
  // Upper limit: the lower tail at x_obs falls as λ grows; find where it equals γ.
  const lowerTailShortfall = (lambda: number) => gamma - noncentralChiSquareTail(statistic, df, lambda, 'lower');
  const high =
    lowerTailShortfall(0) >= 0
      ? 0
      : findRoot(lowerTailShortfall, ...bracket(lowerTailShortfall, statistic, df), 1e-10, 1e-300, ROOT_STEP_LIMIT);
  // Lower limit: the upper tail at x_obs rises with λ; find where it equals γ.
  const upperTailExcess = (lambda: number) => noncentralChiSquareTail(statistic, df, lambda, 'upper') - gamma;
  const low =
    upperTailExcess(0) >= 0 ? 0 : findRoot(upperTailExcess, ...bracket(upperTailExcess, statistic, df), 1e-10, 1e-300, ROOT_STEP_LIMIT);
  return { low, high };
}
