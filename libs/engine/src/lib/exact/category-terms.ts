/**
 * Per-category terms of the three orderings of the exact multinomial test. Every statistic used
 * here is a sum of one term per category, which is what lets the search split the categories
 * into two halves and prune with per-category bounds.
 *
 * With expected count e = nπ for a category observed y times:
 * - `pearson`: (y − e)² / e, summing to Pearson's X².
 * - `llr`: 2 D(y, e) with Loader's deviance term D(y, e) = y ln(y / e) + e − y ≥ 0. Because
 *   Σ (e − y) = 0 these sum to G = 2 Σ y ln(y / e), but each term is non-negative and computed
 *   without cancellation.
 * - `probability`: −ln(e^y e^{−e} / y!), the negative Poisson log-density. The multinomial
 *   probability is the product of Poisson densities divided by the Poisson density of the total:
 *     ln P(y) = −ln dpois(n; n) + Σ ln dpois(y_i; e_i),
 *   so ordering by this sum orders outcomes by probability (larger sum = less probable).
 *   Loader's (2000) saddle-point form keeps each term accurate to ~1e-15 absolute at any n.
 *
 * All three terms are convex in y, which the pruning bounds rely on.
 */
import { devianceTerm, logPoissonDensity } from '../special/poisson-density';

export type OrderingName = 'probability' | 'llr' | 'pearson';

/** The term of one category under an ordering; larger totals are more extreme. */
export function statisticTerm(ordering: OrderingName, y: number, expected: number): number {
  switch (ordering) {
    case 'pearson': {
      const d = y - expected;
      return (d * d) / expected;
    }
    case 'llr':
      return 2 * devianceTerm(y, expected);
    case 'probability':
      return -logPoissonDensity(y, expected);
  }
}

/** ln of the Poisson density of one category: the outcome's log-probability is the sum plus `logProbabilityOffset(n)`. */
export function logWeightTerm(y: number, expected: number): number {
  return logPoissonDensity(y, expected);
}

/** −ln dpois(n; n): added to the sum of `logWeightTerm`s it gives the multinomial log-probability. */
export function logProbabilityOffset(n: number): number {
  return -logPoissonDensity(n, n);
}

/**
 * The threshold an outcome's statistic must reach to count as at least as extreme as the
 * observed one. Ties are judged with a relative tolerance of 1e-7 so that outcomes equal in exact
 * arithmetic are not split by rounding: for `probability`, P(y) ≤ P(obs)·e^{1e-7} (relative on the
 * probability scale, i.e. absolute on the log scale); for `llr` and `pearson`, S(y) ≥ S(obs)(1 − 1e-7).
 */
export const TIE_TOLERANCE = 1e-7;

export function extremeThreshold(ordering: OrderingName, observedStatistic: number): number {
  return ordering === 'probability'
    ? observedStatistic - TIE_TOLERANCE
    : observedStatistic - TIE_TOLERANCE * Math.abs(observedStatistic);
}
