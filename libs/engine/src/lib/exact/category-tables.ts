/**
 * Per-category lookup tables over the counts a category can take in any outcome the search must
 * visit (its window), so the inner loops read Float64Arrays instead of calling logarithms.
 *
 * A window is the interval of counts y for which a bound on the whole outcome still allows it:
 * - looking for outcomes less extreme than the observed one ("core" search), y is kept while a
 *   lower bound on the full statistic given this one count stays below the threshold. The bound
 *   collapses the other categories into one, which can only lower the statistic: for Pearson and
 *   G by the convexity of their terms (the continuous optimum spreads the rest in proportion), for
 *   the probability ordering because P(outcome) ≤ P(this category's count) = a binomial probability;
 * - cutting off negligible outcomes ("tail" search), y is kept while its binomial probability is
 *   at least the cut-off, since no outcome can be more probable than any of its margins.
 * Both bounds are unimodal in y, so each window is an interval found by bisection on each side.
 */
import { binomialLogProbability } from '../binomial/binomial-log-probability';
import { devianceTerm } from '../special/poisson-density';
import { logWeightTerm, OrderingName, statisticTerm } from './category-terms';

export interface CategoryTable {
  /** smallest count in the window */
  lo: number;
  /** largest count in the window (hi < lo means the window is empty) */
  hi: number;
  expected: number;
  /** statistic term of count lo + i at index i */
  stat: Float64Array;
  /** log-probability term (ln Poisson density) of count lo + i */
  weight: Float64Array;
  /** the term the search prunes on: `stat` for the core search, −`weight` for the tail search */
  score: Float64Array;
}

/** The outcome-level condition one category's count must meet; true on an interval of counts. */
export type CountFilter = (y: number) => boolean;

/**
 * Filter for the core search: could an outcome with this count still have a statistic below
 * `limit`? Uses the two-category collapse described above.
 */
export function coreCountFilter(
  ordering: OrderingName,
  n: number,
  share: number,
  limit: number,
  logProbabilityOffset: number,
): CountFilter {
  const expected = n * share;
  const rest = n - expected;
  switch (ordering) {
    case 'pearson':
      return (y) => {
        const d = y - expected;
        return (d * d) / expected + (d * d) / rest < limit;
      };
    case 'llr':
      return (y) => 2 * (devianceTerm(y, expected) + devianceTerm(n - y, rest)) < limit;
    case 'probability':
      return (y) => logProbabilityOffset - binomialLogProbability(y, n, share) < limit;
  }
}

/** Filter for the tail search: is this count's binomial log-probability at least `logCutoff`? */
export function tailCountFilter(n: number, share: number, logCutoff: number): CountFilter {
  return (y) => binomialLogProbability(y, n, share) >= logCutoff;
}

/** The interval of y in [0, n] where `keep` holds, given that it holds on an interval containing one of the candidates if anywhere. */
export function countWindow(n: number, share: number, keep: CountFilter): { lo: number; hi: number } {
  const expected = n * share;
  const candidates = [Math.floor(expected), Math.ceil(expected), Math.floor((n + 1) * share)];
  let center = -1;
  for (const candidate of candidates) {
    const y = Math.min(n, Math.max(0, candidate));
    if (keep(y)) {
      center = y;
      break;
    }
  }
  if (center < 0) return { lo: 1, hi: 0 };
  // Bisection: keep(inside) is true, keep(outside) is false or outside is past the support.
  let inside = center;
  let outside = n + 1;
  while (outside - inside > 1) {
    const middle = inside + Math.floor((outside - inside) / 2);
    if (keep(middle)) inside = middle;
    else outside = middle;
  }
  const hi = inside;
  inside = center;
  outside = -1;
  while (inside - outside > 1) {
    const middle = outside + Math.ceil((inside - outside) / 2);
    if (keep(middle)) inside = middle;
    else outside = middle;
  }
  return { lo: inside, hi };
}

/** Builds the lookup table of one category over [lo, hi]. */
export function buildCategoryTable(
  ordering: OrderingName,
  expected: number,
  lo: number,
  hi: number,
  scoreIsStatistic: boolean,
): CategoryTable {
  const length = Math.max(0, hi - lo + 1);
  const stat = new Float64Array(length);
  const weight = new Float64Array(length);
  for (let i = 0; i < length; i++) {
    stat[i] = statisticTerm(ordering, lo + i, expected);
    weight[i] = logWeightTerm(lo + i, expected);
  }
  let score: Float64Array;
  if (scoreIsStatistic) score = stat;
  else {
    score = new Float64Array(length);
    for (let i = 0; i < length; i++) score[i] = -weight[i];
  }
  return { lo, hi, expected, stat, weight, score };
}
