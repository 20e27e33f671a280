import type { AnalysisSpec } from '@tallyfit/engine';

export type EngineLane = 'small' | 'large';

/** Beyond this many categories a run is never called small (intervals and post-hoc rows grow with k). */
const SMALL_MAX_CATEGORIES = 50;
/** Full enumeration of this many outcome vectors takes milliseconds; the exact test is then cheap. */
const SMALL_MAX_OUTCOMES = 200_000;
/** The engine's default Monte Carlo draw count; asking for more is long work. */
const SMALL_MAX_SAMPLES = 100_000;
/** The chi-square tests stand alone when every expected count is at least 5 (stricter than Cochran's rule, so the engine agrees). */
const LARGE_EXPECTED_COUNT = 5;

/**
 * Sorts a run into the small lane (answers in milliseconds: the chi-square tests, a binomial test,
 * a tiny exact test) or the large lane (an exact or Monte Carlo test that may use its whole time
 * limit). Only the exact multinomial test's work grows beyond the input's size, so the question
 * is whether it runs and how much it may do. When unsure, the run is large: a long run in the
 * small lane would hold up every ordinary analysis behind it.
 */
export function engineLane(spec: AnalysisSpec): EngineLane {
  const counts = spec.observed.counts;
  const k = counts.length;
  if (k > SMALL_MAX_CATEGORIES) return 'large';
  if (!exactMayRun(spec)) return 'small';
  const method = spec.exact?.method ?? 'auto';
  const ordering = spec.exact?.ordering ?? 'probability';
  // Two categories under the default ordering are answered by the binomial test.
  if (k === 2 && ordering === 'probability' && method !== 'monte-carlo') return 'small';
  if (method === 'monte-carlo') return (spec.exact?.samples ?? SMALL_MAX_SAMPLES) <= SMALL_MAX_SAMPLES ? 'small' : 'large';
  const n = counts.reduce((total, count) => total + count, 0);
  return outcomeVectors(n, k) <= SMALL_MAX_OUTCOMES ? 'small' : 'large';
}

/** The exact test runs when it is listed, or (no tests listed) when some expected count is small. */
function exactMayRun(spec: AnalysisSpec): boolean {
  if (spec.tests) return spec.tests.includes('exact');
  const shares = hypothesisShares(spec);
  if (!shares) return true;
  const n = spec.observed.counts.reduce((total, count) => total + count, 0);
  return shares.some((share) => share > 0 && n * share < LARGE_EXPECTED_COUNT);
}

/** The expected shares when the hypothesis states them outright; undefined for fitted distributions. */
function hypothesisShares(spec: AnalysisSpec): number[] | undefined {
  const hypothesis = spec.hypothesis;
  const k = spec.observed.counts.length;
  if (hypothesis.kind === 'equal') return new Array<number>(k).fill(1 / k);
  if (hypothesis.kind === 'distribution') return undefined;
  const total = hypothesis.values.reduce((sum, value) => sum + value, 0);
  return hypothesis.values.map((value) => value / total);
}

/** C(n + k − 1, k − 1), the number of ways n observations fall into k categories; stops counting past the small limit. */
function outcomeVectors(n: number, k: number): number {
  let ways = 1;
  for (let i = 1; i < k; i++) {
    ways = (ways * (n + i)) / i;
    if (ways > SMALL_MAX_OUTCOMES) return Infinity;
  }
  return ways;
}
