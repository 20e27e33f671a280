/**
 * Exact multinomial goodness-of-fit test by full enumeration of all C(n + k − 1, k − 1) outcomes,
 * with a seeded Monte Carlo estimate when the enumeration would be too large. The p-value sums
 * P(y) over outcomes at least as extreme as the observed one under the chosen ordering:
 * `probability` (P(y) <= P(obs)), `llr` (G(y) >= G(obs)) or `pearson` (X²(y) >= X²(obs)), each with
 * a relative tie tolerance of 1e-7.
 */
import { logFactorial } from '../special/log-gamma';

export type ExactOrdering = 'probability' | 'llr' | 'pearson';
export type ExactMethod = 'auto' | 'enumerate' | 'monte-carlo';

export interface ExactTestOptions {
  ordering: ExactOrdering;
  method: ExactMethod;
  samples?: number;
  seed?: number;
  workBudget?: number;
  onProgress?: (fraction: number) => void;
}

export interface ExactTestOutcome {
  ordering: ExactOrdering;
  method: 'enumerate' | 'monte-carlo';
  p: number;
  logP: number;
  se?: number;
  samples?: number;
  outcomesVisited?: number;
  massBound?: number;
}

const TIE = 1e-7;
const DEFAULT_BUDGET = 2_000_000;
const DEFAULT_SAMPLES = 100_000;

function outcomeCount(n: number, k: number): number {
  return Math.exp(logFactorial(n + k - 1) - logFactorial(k - 1) - logFactorial(n));
}

/** The statistic whose large values count as extreme, and its tie-tolerant threshold test. */
function extremeness(ordering: ExactOrdering, probabilities: readonly number[], n: number) {
  const logShares = probabilities.map((p) => Math.log(p));
  const logN = Math.log(n);
  return (y: readonly number[]): number => {
    let value = 0;
    for (let i = 0; i < y.length; i++) {
      const yi = y[i];
      if (ordering === 'probability') value -= yi * logShares[i] - logFactorial(yi);
      else if (ordering === 'llr') value += yi > 0 ? 2 * yi * (Math.log(yi) - logN - logShares[i]) : 0;
      else value += (yi - n * probabilities[i]) ** 2 / (n * probabilities[i]);
    }
    return value;
  };
}

function isAtLeast(value: number, observed: number): boolean {
  return value >= observed - TIE * Math.max(1, Math.abs(observed));
}

function logMultinomial(y: readonly number[], logShares: readonly number[], logNFactorial: number): number {
  let value = logNFactorial;
  for (let i = 0; i < y.length; i++) value += y[i] * logShares[i] - logFactorial(y[i]);
  return value;
}

function enumerate(counts: readonly number[], probabilities: readonly number[], ordering: ExactOrdering): ExactTestOutcome {
  const k = counts.length;
  const n = counts.reduce((a, b) => a + b, 0);
  const statistic = extremeness(ordering, probabilities, n);
  const observed = statistic(counts);
  const logShares = probabilities.map((p) => (p > 0 ? Math.log(p) : -Infinity));
  const logNFactorial = logFactorial(n);
  const y = new Array<number>(k).fill(0);
  let p = 0;
  let visited = 0;
  const visit = (index: number, remaining: number) => {
    if (index === k - 1) {
      y[index] = remaining;
      visited++;
      if (isAtLeast(statistic(y), observed)) p += Math.exp(logMultinomial(y, logShares, logNFactorial));
      return;
    }
    for (let value = 0; value <= remaining; value++) {
      y[index] = value;
      visit(index + 1, remaining - value);
    }
  };
  visit(0, n);
  p = Math.min(1, p);
  return { ordering, method: 'enumerate', p, logP: Math.log(p), outcomesVisited: visited };
}

/** Mulberry32, a small seeded 32-bit generator (common practice, no source). */
function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function monteCarlo(
  counts: readonly number[],
  probabilities: readonly number[],
  ordering: ExactOrdering,
  samples: number,
  seed: number,
  onProgress?: (fraction: number) => void,
): ExactTestOutcome {
  const k = counts.length;
  const n = counts.reduce((a, b) => a + b, 0);
  const statistic = extremeness(ordering, probabilities, n);
  const observed = statistic(counts);
  const cumulative: number[] = [];
  probabilities.reduce((acc, p, i) => (cumulative[i] = acc + p), 0);
  const uniform = seededUniform(seed);
  const y = new Array<number>(k).fill(0);
  let hits = 0;
  for (let s = 0; s < samples; s++) {
    y.fill(0);
    for (let draw = 0; draw < n; draw++) {
      const u = uniform() * cumulative[k - 1];
      let i = 0;
      while (i < k - 1 && u >= cumulative[i]) i++;
      y[i]++;
    }
    if (isAtLeast(statistic(y), observed)) hits++;
    if (onProgress && s % 1000 === 0) onProgress(s / samples);
  }
  // Count the observed table itself (Davison & Hinkley 1997, eq. 4.11) so p is never 0.
  const p = (hits + 1) / (samples + 1);
  return { ordering, method: 'monte-carlo', p, logP: Math.log(p), se: Math.sqrt((p * (1 - p)) / samples), samples };
}

export function exactMultinomialTest(
  counts: readonly number[],
  probabilities: readonly number[],
  options: ExactTestOptions,
): ExactTestOutcome {
  const n = counts.reduce((a, b) => a + b, 0);
  const budget = options.workBudget ?? DEFAULT_BUDGET;
  const useEnumeration =
    options.method === 'enumerate' || (options.method === 'auto' && outcomeCount(n, counts.length) <= budget);
  if (useEnumeration) return enumerate(counts, probabilities, options.ordering);
  return monteCarlo(counts, probabilities, options.ordering, options.samples ?? DEFAULT_SAMPLES, options.seed ?? 0, options.onProgress);
}
