/**
 * The exact multinomial goodness-of-fit test: the probability, under the hypothesised shares, of
 * an outcome at least as extreme as the observed counts, with "extreme" judged by one of three
 * orderings:
 * - `probability`: outcomes no more probable than the observed one (the classical exact test;
 *   with two categories, the two-sided exact binomial test);
 * - `llr`: outcomes whose likelihood-ratio statistic G is at least the observed one;
 * - `pearson`: outcomes whose Pearson X² is at least the observed one.
 * Ties are judged with a relative tolerance of 1e-7 (see category-terms.ts).
 *
 * `method: 'enumerate'` computes the exact value (exact-search.ts), refusing only problems beyond
 * ENUMERATION_WORK_LIMIT; `'monte-carlo'` always samples (monte-carlo-test.ts); `'auto'` computes
 * exactly while the counted work stays within `workBudget` and samples otherwise.
 */
import { EngineInputError } from '../spec/engine-input-error';
import { SHARE_SUM_EXACT_TOLERANCE } from '../spec/share-tolerance';
import { exactMethods, exactOrderings, type ExactMethod, type ExactOrdering } from '../spec/vocabulary';
import { OrderingName } from './category-terms';
import { exactSearch } from './exact-search';
import { monteCarloTest } from './monte-carlo-test';

export type { ExactMethod, ExactOrdering } from '../spec/vocabulary';

export interface ExactTestOptions {
  ordering: ExactOrdering;
  method: ExactMethod;
  /** Monte Carlo draws (default 100 000) */
  samples?: number;
  /** Monte Carlo seed (default 20250101); the same seed gives the same result */
  seed?: number;
  /** largest exact work (listed partial outcomes plus counting visits) before `auto` samples instead; default 30 000 000 */
  workBudget?: number;
  /** called with the fraction done, in [0, 1], during the computation */
  onProgress?: (fraction: number) => void;
}

export interface ExactTestOutcome {
  ordering: ExactOrdering;
  method: 'enumerate' | 'monte-carlo';
  p: number;
  /** ln p, finite even where p underflows to 0 */
  logP: number;
  /** Monte Carlo standard error of p */
  se?: number;
  /** Monte Carlo draws */
  samples?: number;
  /** partial outcome vectors the exact search listed */
  outcomesVisited?: number;
  /** certified upper bound on the probability of extreme outcomes the exact search left out as negligible */
  massBound?: number;
}

export const DEFAULT_MONTE_CARLO_SAMPLES = 100_000;
export const DEFAULT_MONTE_CARLO_SEED = 20250101;
/**
 * One work unit is one partial outcome vector listed (16 bytes while listed) or visited while
 * counting. Measured at about 15 million units per CPU-second on a 2-core machine (tools/bench),
 * so the default keeps `auto` under ~2 s and ~500 MB.
 */
export const DEFAULT_WORK_BUDGET = 30_000_000;
/** Even `method: 'enumerate'` stops here (~1.6 GB of lists) rather than exhaust memory. */
export const ENUMERATION_WORK_LIMIT = 100_000_000;


interface CanonicalInput {
  n: number;
  shares: number[];
  observed: number[];
}

/**
 * Checks the input and puts it in canonical form: categories with zero probability dropped
 * (their count must be 0), shares renormalised to sum to exactly 1, categories sorted by share
 * and then by count — so the result cannot depend on the order categories were given in.
 */
function canonicalInput(counts: readonly number[], probabilities: readonly number[]): CanonicalInput {
  if (!Array.isArray(counts)) throw EngineInputError.at('counts', 'must be an array of counts');
  if (!Array.isArray(probabilities)) throw EngineInputError.at('probabilities', 'must be an array of probabilities');
  if (counts.length < 2) throw EngineInputError.at('counts', `needs at least 2 categories, got ${counts.length}`);
  if (probabilities.length !== counts.length) {
    throw EngineInputError.at(
      'probabilities',
      `needs one probability per category: ${counts.length} counts but ${probabilities.length} probabilities`,
    );
  }
  counts.forEach((count, i) => {
    if (typeof count !== 'number' || !Number.isSafeInteger(count) || count < 0) {
      throw EngineInputError.at(`counts.${i}`, `must be a whole number >= 0, got ${String(count)}`);
    }
  });
  probabilities.forEach((share, i) => {
    if (typeof share !== 'number' || !Number.isFinite(share) || share < 0) {
      throw EngineInputError.at(`probabilities.${i}`, `must be a finite number >= 0, got ${String(share)}`);
    }
    if (share === 0 && counts[i] > 0) {
      throw EngineInputError.at(`counts.${i}`, `is ${counts[i]} but the category's probability is 0`);
    }
  });
  const kept = counts
    .map((count, i) => ({ count, share: probabilities[i] }))
    .filter((category) => category.share > 0)
    .sort((a, b) => a.share - b.share || a.count - b.count);
  // Summed in canonical order, so the renormalised shares do not depend on the input order.
  const sum = kept.reduce((total, category) => total + category.share, 0);
  if (!(Math.abs(sum - 1) <= SHARE_SUM_EXACT_TOLERANCE)) {
    throw EngineInputError.at('probabilities', `must sum to 1 (within ${SHARE_SUM_EXACT_TOLERANCE}), got ${sum}`);
  }
  return {
    n: kept.reduce((total, category) => total + category.count, 0),
    shares: kept.map((category) => category.share / sum),
    observed: kept.map((category) => category.count),
  };
}

function checkOptions(options: ExactTestOptions): void {
  if (!options || typeof options !== 'object') throw EngineInputError.at('options', 'must be an object');
  if (!exactOrderings.includes(options.ordering)) {
    throw EngineInputError.at('options.ordering', `must be one of ${exactOrderings.join(', ')}, got ${String(options.ordering)}`);
  }
  if (!exactMethods.includes(options.method)) {
    throw EngineInputError.at('options.method', `must be one of ${exactMethods.join(', ')}, got ${String(options.method)}`);
  }
  if (options.samples !== undefined && !(Number.isSafeInteger(options.samples) && options.samples >= 1)) {
    throw EngineInputError.at('options.samples', `must be a whole number >= 1, got ${String(options.samples)}`);
  }
  if (options.seed !== undefined && !Number.isSafeInteger(options.seed)) {
    throw EngineInputError.at('options.seed', `must be a whole number, got ${String(options.seed)}`);
  }
  if (options.workBudget !== undefined && !(typeof options.workBudget === 'number' && options.workBudget > 0)) {
    throw EngineInputError.at('options.workBudget', `must be a number > 0, got ${String(options.workBudget)}`);
  }
  if (options.onProgress !== undefined && typeof options.onProgress !== 'function') {
    throw EngineInputError.at('options.onProgress', 'must be a function');
  }
}

/** The exact multinomial test of `counts` against `probabilities` (see the file header). */
export function exactMultinomialTest(
  counts: readonly number[],
  probabilities: readonly number[],
  options: ExactTestOptions,
): ExactTestOutcome {
  checkOptions(options);
  const input = canonicalInput(counts, probabilities);
  const ordering: OrderingName = options.ordering;
  if (input.shares.length < 2 || input.n === 0) {
    // A single possible outcome: it is the observed one.
    options.onProgress?.(1);
    return { ordering, method: 'enumerate', p: 1, logP: 0, outcomesVisited: 1, massBound: 0 };
  }
  if (options.method !== 'monte-carlo') {
    const forced = options.method === 'enumerate';
    const budget = forced ? ENUMERATION_WORK_LIMIT : (options.workBudget ?? DEFAULT_WORK_BUDGET);
    const exact = exactSearch({ ordering, ...input }, budget, options.onProgress);
    if (!exact && forced) {
      throw EngineInputError.at(
        'options.method',
        `exact enumeration would need more than ${ENUMERATION_WORK_LIMIT} work units for these counts; use 'auto' or 'monte-carlo'`,
      );
    }
    if (exact) {
      return {
        ordering,
        method: 'enumerate',
        p: exact.p,
        logP: exact.logP,
        outcomesVisited: exact.outcomesVisited,
        massBound: exact.massBound,
      };
    }
  }
  const sampled = monteCarloTest(
    ordering,
    input.n,
    input.shares,
    input.observed,
    options.samples ?? DEFAULT_MONTE_CARLO_SAMPLES,
    options.seed ?? DEFAULT_MONTE_CARLO_SEED,
    options.onProgress,
  );
  return { ordering, method: 'monte-carlo', ...sampled };
}
