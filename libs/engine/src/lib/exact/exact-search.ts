/**
 * Exact p-value of the multinomial test by a meet-in-the-middle search that visits only the
 * outcomes it must.
 *
 * Two searches, chosen by how small p is expected to be:
 * - Core search (p not tiny): lists, for each half of the categories, only the partial vectors
 *   that can belong to an outcome LESS extreme than the observed one — the region around the
 *   expected counts that Resin (2023, "A fast method for the exact multinomial test", J. Comput.
 *   Graph. Stat. 32:539–550) enumerates outcome by outcome — and joins the halves. No outcome is
 *   left out, so the result is exact: p = 1 − (mass less extreme than observed).
 * - Tail search (p tiny, where 1 − mass would cancel): sums the extreme outcomes directly, leaving
 *   out only outcomes with probability below a cut-off τ. At most C(n + k − 1, k − 1) outcomes
 *   exist, so the mass left out is certified to be at most that count × τ; τ is set so that bound
 *   is 1e-10 × a proven lower bound of p (the observed outcome's own probability, or the result of
 *   a first pass, since a partial sum of extreme outcomes never exceeds p).
 *
 * Work is counted before anything is materialised (see half-enumeration.ts), so a search that
 * would exceed the budget is abandoned after only a cheap counting pass.
 */
import { chiSquareLogSurvival } from '../distributions/chi-square';
import { logGamma } from '../special/log-gamma';
import {
  buildCategoryTable,
  CategoryTable,
  CountFilter,
  coreCountFilter,
  countWindow,
  tailCountFilter,
} from './category-tables';
import { extremeThreshold, logProbabilityOffset, logWeightTerm, OrderingName, statisticTerm } from './category-terms';
import { countHalf, fillHalf, HalfCounts, HalfLayout, HalfLists } from './half-enumeration';
import { chooseHalfSplit } from './half-split';
import { logMassAtOrAboveThreshold, massBelowThreshold, sortBuckets } from './meet-in-the-middle';
import { buildSuffixMinimum } from './suffix-minimum';

export interface ExactProblem {
  ordering: OrderingName;
  n: number;
  /** positive shares summing to 1, sorted ascending (equal shares adjacent) */
  shares: readonly number[];
  /** observed counts, aligned with `shares` */
  observed: readonly number[];
}

export interface ExactSearchOutcome {
  p: number;
  logP: number;
  /** partial outcome vectors listed in the two halves */
  outcomesVisited: number;
  /** certified upper bound on the extreme probability left out by the cut-off */
  massBound: number;
  /** work units spent (counting visits plus listed vectors) */
  work: number;
}

/** p at or above this from the core search is accurate to ~1e-9 relative; below it the tail search takes over. */
const CORE_RELIABLE_P = 1e-5;
/** Below this chi-square approximation of p, the core region is nearly everything: go straight to the tail search. */
const TAIL_FIRST_LOG_P = Math.log(1e-7);
/** Mass left out by the tail search, relative to a lower bound of p. */
const RELATIVE_CUTOFF = 1e-10;
/** The tail search tightens its cut-off at most this many times. */
const MAX_TAIL_PASSES = 3;
/** Skip a search outright when the volume estimate exceeds the remaining budget this many times over. */
const PRESCREEN_FACTOR = 8;

interface SearchContext {
  problem: ExactProblem;
  expected: number[];
  threshold: number;
  logOffset: number;
  logObserved: number;
  /** Pearson X² of the observed counts: sets how far from expectation each search reaches */
  pearson: number;
  budget: number;
  spent: number;
  onProgress?: (fraction: number) => void;
  progressFrom: number;
  progressTo: number;
}

type Attempt = { kind: 'done'; outcome: ExactSearchOutcome } | { kind: 'over-budget' };
/** The core search also learns when no outcome at all is less extreme than the observed one. */
type CoreAttempt = Attempt | { kind: 'all-extreme' };

/** Tolerance added to pruning limits so that rounding in the bounds never prunes an outcome the join needs. */
function pruningSlack(value: number): number {
  return 1e-9 * (1 + Math.abs(value));
}

function layoutFor(
  tables: readonly CategoryTable[],
  shares: readonly number[],
  half: readonly number[],
  other: readonly number[],
  n: number,
  limit: number,
): HalfLayout {
  const order = [...half, ...other];
  const ordered = order.map((i) => tables[i]);
  const groupPosition = new Int32Array(order.length);
  for (let j = 0; j < order.length; j++) {
    groupPosition[j] = j > 0 && j < half.length && shares[order[j]] === shares[order[j - 1]] ? groupPosition[j - 1] + 1 : 1;
  }
  return { n, tables: ordered, suffix: buildSuffixMinimum(ordered), size: half.length, groupPosition, limit };
}

/**
 * Windows, split, tables, layouts and counts for one search ('empty' when some category admits no
 * count at all). `reach` is how far the search extends on the chi-square scale.
 */
function prepare(
  context: SearchContext,
  reach: number,
  filterFor: (i: number) => CountFilter,
  scoreIsStatistic: boolean,
  limit: number,
):
  | { kind: 'empty' }
  | { kind: 'over-budget' }
  | { kind: 'ready'; layouts: HalfLayout[]; counts: HalfCounts[]; work: number } {
  const { problem, expected } = context;
  const { shares, n } = problem;
  const windows = shares.map((share, i) => countWindow(n, share, filterFor(i)));
  if (windows.some((window) => window.hi < window.lo)) return { kind: 'empty' };
  const widths = windows.map((window) => window.hi - window.lo + 1);
  const split = chooseHalfSplit(shares, n, Math.sqrt(Math.max(reach, 1)), widths);
  // The volume estimate is accurate to a small factor; far over budget, skip even the counting pass.
  if (split.estimatedWork > PRESCREEN_FACTOR * (context.budget - context.spent)) return { kind: 'over-budget' };
  const tables = windows.map((window, i) =>
    buildCategoryTable(problem.ordering, expected[i], window.lo, window.hi, scoreIsStatistic),
  );
  const layouts = [layoutFor(tables, problem.shares, split.first, split.second, problem.n, limit)];
  if (!split.mirrored) layouts.push(layoutFor(tables, problem.shares, split.second, split.first, problem.n, limit));
  const counts: HalfCounts[] = [];
  let work = 0;
  for (const layout of layouts) {
    const count = countHalf(layout, context.budget - context.spent - work);
    if (!count) return { kind: 'over-budget' };
    work += count.prefixes + count.elements;
    counts.push(count);
  }
  return { kind: 'ready', layouts, counts, work };
}

/** Fills both halves' lists (sorting their buckets if asked), reporting progress over the first part of this attempt's range. */
function materialise(context: SearchContext, layouts: HalfLayout[], counts: HalfCounts[], sorted: boolean): HalfLists[] {
  const total = counts.reduce((sum, c) => sum + c.elements, 0);
  let done = 0;
  const span = context.progressTo - context.progressFrom;
  const lists = layouts.map((layout, h) => {
    const filled = fillHalf(layout, counts[h], (written) =>
      context.onProgress?.(context.progressFrom + (0.6 * span * (done + written)) / Math.max(total, 1)),
    );
    done += counts[h].elements;
    if (sorted) sortBuckets(filled);
    return filled;
  });
  return lists;
}

function joinProgress(context: SearchContext): ((fraction: number) => void) | undefined {
  const { onProgress, progressFrom, progressTo } = context;
  if (!onProgress) return undefined;
  return (fraction) => onProgress(progressFrom + (0.6 + 0.4 * fraction) * (progressTo - progressFrom));
}

function coreSearch(context: SearchContext): CoreAttempt {
  const { problem, threshold, logOffset } = context;
  const limit = threshold + pruningSlack(threshold);
  const prepared = prepare(
    context,
    context.pearson,
    (i) => coreCountFilter(problem.ordering, problem.n, problem.shares[i], limit, logOffset),
    true,
    limit,
  );
  if (prepared.kind === 'empty') return { kind: 'all-extreme' };
  if (prepared.kind === 'over-budget') return prepared;
  context.spent += prepared.work;
  const lists = materialise(context, prepared.layouts, prepared.counts, false);
  const second = lists.length > 1 ? lists[1] : lists[0];
  const lessExtreme = massBelowThreshold(lists[0], second, problem.n, threshold, logOffset, joinProgress(context));
  const p = Math.min(1, Math.max(0, 1 - lessExtreme));
  return {
    kind: 'done',
    outcome: {
      p,
      logP: Math.log(p),
      outcomesVisited: prepared.counts.reduce((sum, c) => sum + c.elements, 0),
      massBound: 0,
      work: prepared.work,
    },
  };
}

function logOutcomeCount(n: number, k: number): number {
  return logGamma(n + k) - logGamma(n + 1) - logGamma(k);
}

function tailSearch(context: SearchContext, logMassBound: number): Attempt {
  const { problem, threshold, logOffset } = context;
  const logCutoff = logMassBound - logOutcomeCount(problem.n, problem.shares.length);
  const slack = pruningSlack(logCutoff);
  const limit = logOffset - logCutoff + slack;
  // The listed region reaches out to probability τ: on the chi-square scale about X²(obs) + 2 ln(P(obs) / τ).
  const reach = context.pearson + 2 * Math.max(0, context.logObserved - logCutoff);
  const prepared = prepare(context, reach, (i) => tailCountFilter(problem.n, problem.shares[i], logCutoff - slack), false, limit);
  // Some count of every category has probability ≥ 1/(n + 1), far above the cut-off.
  if (prepared.kind === 'empty') throw new Error('the tail search found a category with no count above the cut-off');
  if (prepared.kind === 'over-budget') return prepared;
  context.spent += prepared.work;
  const lists = materialise(context, prepared.layouts, prepared.counts, true);
  const second = lists.length > 1 ? lists[1] : lists[0];
  const logP = Math.min(0, logMassAtOrAboveThreshold(lists[0], second, problem.n, threshold, logOffset, joinProgress(context)));
  return {
    kind: 'done',
    outcome: {
      p: Math.exp(logP),
      logP,
      outcomesVisited: prepared.counts.reduce((sum, c) => sum + c.elements, 0),
      massBound: Math.exp(logMassBound),
      work: prepared.work,
    },
  };
}

/**
 * Runs the exact search within `budget` work units; returns undefined when it cannot finish
 * within the budget (the caller then falls back to Monte Carlo).
 */
export function exactSearch(
  problem: ExactProblem,
  budget: number,
  onProgress?: (fraction: number) => void,
): ExactSearchOutcome | undefined {
  const { n, shares, observed, ordering } = problem;
  const k = shares.length;
  const expected = shares.map((share) => n * share);
  let observedStatistic = 0;
  let logObserved = logProbabilityOffset(n);
  let pearson = 0;
  for (let i = 0; i < k; i++) {
    observedStatistic += statisticTerm(ordering, observed[i], expected[i]);
    logObserved += logWeightTerm(observed[i], expected[i]);
    pearson += statisticTerm('pearson', observed[i], expected[i]);
  }
  const logApproximateP = chiSquareLogSurvival(pearson, k - 1);
  const context: SearchContext = {
    problem,
    expected,
    threshold: extremeThreshold(ordering, observedStatistic),
    logOffset: logProbabilityOffset(n),
    logObserved,
    pearson,
    budget,
    spent: 0,
    onProgress,
    progressFrom: 0,
    progressTo: 1,
  };

  let lowerBound = logObserved; // the observed outcome is itself extreme
  let visited = 0;
  if (logApproximateP > TAIL_FIRST_LOG_P) {
    context.progressTo = 0.5;
    const core = coreSearch(context);
    if (core.kind === 'all-extreme') return { p: 1, logP: 0, outcomesVisited: 0, massBound: 0, work: context.spent };
    if (core.kind === 'done') {
      visited = core.outcome.outcomesVisited;
      if (core.outcome.p >= CORE_RELIABLE_P) {
        onProgress?.(1);
        return { ...core.outcome, work: context.spent };
      }
      // The core result is accurate to ~1e-14 absolute: a usable lower bound for the cut-off.
      if (core.outcome.p > 1e-12) lowerBound = Math.max(lowerBound, Math.log(core.outcome.p - 1e-12));
    } else if (logApproximateP > Math.log(1e-4)) {
      return undefined; // p is not small, so the tail search would need even more work
    }
  }
  context.progressFrom = context.progressTo;
  context.progressTo = 1;
  // First pass: cut-off from the chi-square approximation of p (never below the proven bound).
  let logMassBound = Math.log(RELATIVE_CUTOFF) + Math.max(lowerBound, Math.min(logApproximateP, 0));
  for (let pass = 1; ; pass++) {
    const tail = tailSearch(context, logMassBound);
    if (tail.kind === 'over-budget') return undefined;
    const outcome = tail.outcome;
    visited += outcome.outcomesVisited;
    // The tail sum is a lower bound of p; accept once what it left out is small against it.
    const provenLower = Math.max(lowerBound, outcome.logP);
    if (logMassBound <= Math.log(1e-8) + provenLower || pass === MAX_TAIL_PASSES) {
      onProgress?.(1);
      return { ...outcome, outcomesVisited: visited, work: context.spent };
    }
    lowerBound = provenLower;
    logMassBound = Math.log(RELATIVE_CUTOFF) + provenLower;
  }
}
