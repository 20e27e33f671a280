/**
 * Monte Carlo p-value of the multinomial test: draws outcomes under the hypothesis and counts
 * those at least as extreme as the observed one.
 *
 * Each outcome is drawn by conditional binomials — Y₁ ~ Bin(n, π₁), then
 * Y_i ~ Bin(n − Y₁ − … − Y_{i−1}, π_i / (π_i + … + π_k)), the last category taking the rest — which
 * is exact and costs k − 1 binomial variates per outcome whatever n is.
 *
 * The estimate is (hits + 1) / (draws + 1), which counts the observed outcome among the draws:
 * it is a valid p-value for any number of draws and never 0 (Davison & Hinkley 1997, "Bootstrap
 * Methods and their Application", §4.2.1; North, Curtis & Sham 2002, Am. J. Hum. Genet. 71:439–441).
 * Its standard error is √(p(1 − p) / draws).
 */
import { sampleBinomial } from './binomial-sampler';
import { extremeThreshold, OrderingName, statisticTerm } from './category-terms';
import { RandomSource } from './random-source';

export interface MonteCarloOutcome {
  p: number;
  logP: number;
  se: number;
  samples: number;
}

/** Counts within this many standard deviations of the expected count are read from a table. */
const TABLE_HALF_WIDTH_SD = 12;
const CHUNK = 4096;

/** Statistic terms of one category, tabulated around its expected count, computed directly outside. */
class TermTable {
  private readonly lo: number;
  private readonly values: Float64Array;

  constructor(
    private readonly ordering: OrderingName,
    private readonly expected: number,
    n: number,
    share: number,
  ) {
    const sd = Math.sqrt(n * share * (1 - share));
    this.lo = Math.max(0, Math.floor(expected - TABLE_HALF_WIDTH_SD * sd - 10));
    const hi = Math.min(n, Math.ceil(expected + TABLE_HALF_WIDTH_SD * sd + 10));
    this.values = new Float64Array(hi - this.lo + 1);
    for (let y = this.lo; y <= hi; y++) this.values[y - this.lo] = statisticTerm(ordering, y, expected);
  }

  term(y: number): number {
    const i = y - this.lo;
    return i >= 0 && i < this.values.length ? this.values[i] : statisticTerm(this.ordering, y, this.expected);
  }
}

export function monteCarloTest(
  ordering: OrderingName,
  n: number,
  shares: readonly number[],
  observed: readonly number[],
  samples: number,
  seed: number,
  onProgress?: (fraction: number) => void,
): MonteCarloOutcome {
  const k = shares.length;
  const expected = shares.map((share) => n * share);
  const tables = shares.map((share, i) => new TermTable(ordering, expected[i], n, share));
  let observedStatistic = 0;
  for (let i = 0; i < k; i++) observedStatistic += statisticTerm(ordering, observed[i], expected[i]);
  const threshold = extremeThreshold(ordering, observedStatistic);

  // Conditional probabilities π_i / (π_i + … + π_k), with the tail sums added from the small end.
  const conditional = new Float64Array(k);
  let rest = 0;
  for (let i = k - 1; i >= 0; i--) {
    rest += shares[i];
    conditional[i] = Math.min(1, shares[i] / rest);
  }

  const random = new RandomSource(seed);
  const counts = new Int32Array(k);
  let hits = 0;
  for (let done = 0; done < samples; ) {
    const chunkEnd = Math.min(samples, done + CHUNK);
    for (; done < chunkEnd; done++) {
      let left = n;
      for (let i = 0; i < k - 1; i++) {
        const y = left > 0 ? sampleBinomial(random, left, conditional[i]) : 0;
        counts[i] = y;
        left -= y;
      }
      counts[k - 1] = left;
      let statistic = 0;
      for (let i = 0; i < k; i++) statistic += tables[i].term(counts[i]);
      if (statistic >= threshold) hits++;
    }
    onProgress?.(done / samples);
  }
  const p = (hits + 1) / (samples + 1);
  return { p, logP: Math.log(p), se: Math.sqrt((p * (1 - p)) / samples), samples };
}
