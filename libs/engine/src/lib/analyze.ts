/**
 * `analyze`: the engine's one entry point. Validates the spec, turns the hypothesis into expected
 * counts, runs the requested tests, checks the assumptions, measures the effect, analyses each
 * category and writes the report. Plain JSON in, plain JSON out.
 */
import { proposeMerge } from './assumptions/propose-merge';
import { summariseExpectedCounts } from './assumptions/cochran-rule';
import { binomialTest } from './binomial/binomial-test';
import { cohensWInterval } from './effect-size/cohens-w-interval';
import { cohensW, effectSizeWord } from './effect-size/cohens-w';
import { ENGINE_VERSION } from './engine-version';
import { DEFAULT_MONTE_CARLO_SEED, exactMultinomialTest } from './exact';
import { resolveHypothesis } from './hypothesis/resolve-hypothesis';
import { shareIntervals } from './intervals/share-intervals';
import { adjustPValues } from './posthoc/adjust-p-values';
import { formatPAt } from './report/format-numbers';
import { cressieReadLine, exactLine, gLine, pearsonLine } from './report/statistics-lines';
import { writeUp } from './report/write-up';
import type {
  Advice,
  AnalysisResult,
  AnalysisTests,
  CategoryRow,
  ExactTestResult,
  MainTest,
  Report,
} from './result/analysis-result';
import type { EngineWarning } from './result/engine-warning';
import type { AnalysisSpec, TestName } from './spec/analysis-spec';
import { EngineInputError } from './spec/engine-input-error';
import { parseAnalysisSpec } from './spec/parse-analysis-spec';
import { chiSquareTestResult } from './statistics/chi-square-test';
import { cressieReadStatistic, DEFAULT_CRESSIE_READ_LAMBDA } from './statistics/cressie-read-statistic';
import { gStatistic, williamsCorrection } from './statistics/g-statistic';
import { pearsonStatistic } from './statistics/pearson-statistic';

export interface AnalyzeOptions {
  /** called with the fraction done (0 to 1) during long exact computations */
  onProgress?: (fraction: number) => void;
}

export const DEFAULT_ALPHA = 0.05;
export const DEFAULT_INTERVAL_LEVEL = 0.95;

interface ExactRun {
  result: ExactTestResult;
  warnings: EngineWarning[];
}

function runExactTest(
  spec: AnalysisSpec,
  counts: readonly number[],
  shares: readonly number[],
  onProgress: AnalyzeOptions['onProgress'],
): ExactRun {
  const ordering = spec.exact?.ordering ?? 'probability';
  const method = spec.exact?.method ?? 'auto';
  if (counts.length === 2 && ordering === 'probability' && method !== 'monte-carlo') {
    const n = counts[0] + counts[1];
    const binomial = binomialTest(counts[0], n, shares[0]);
    return { result: { ordering, method: 'binomial', p: binomial.p, logP: binomial.logP }, warnings: [] };
  }
  const outcome = exactMultinomialTest(counts, shares, {
    ordering,
    method,
    samples: spec.exact?.samples,
    seed: spec.exact?.seed,
    onProgress,
  });
  const result: ExactTestResult = { ordering: outcome.ordering, method: outcome.method, p: outcome.p, logP: outcome.logP };
  if (outcome.se !== undefined) result.se = outcome.se;
  if (outcome.samples !== undefined) result.samples = outcome.samples;
  if (outcome.method === 'monte-carlo') result.seed = spec.exact?.seed ?? DEFAULT_MONTE_CARLO_SEED;
  if (outcome.outcomesVisited !== undefined) result.outcomesVisited = outcome.outcomesVisited;
  if (outcome.massBound !== undefined) result.massBound = outcome.massBound;
  const warnings: EngineWarning[] = [];
  if (outcome.method === 'monte-carlo' && method === 'auto') {
    warnings.push({
      code: 'exact-by-simulation',
      message: `Full enumeration would have taken too long, so the exact test's p-value was estimated from ${outcome.samples ?? 0} simulated samples (standard error ${(outcome.se ?? 0).toPrecision(2)}).`,
    });
  }
  return { result, warnings };
}

function chooseMainTest(requested: readonly TestName[] | undefined, ran: readonly TestName[], cochranOk: boolean): MainTest {
  if (ran.includes('exact') && (!cochranOk || !requested || requested[0] === 'exact')) return 'exact';
  return ran.find((test) => test !== 'exact') ?? 'exact';
}

function mainTestReason(
  main: MainTest,
  requested: readonly TestName[] | undefined,
  summary: ReturnType<typeof summariseExpectedCounts>,
  k: number,
): string {
  const rule = `${summary.cellsBelow5} of ${k} expected counts ${summary.cellsBelow5 === 1 ? 'was' : 'were'} below 5${
    summary.cellsBelow1 > 0 ? ` (${summary.cellsBelow1} below 1)` : ''
  }, which breaks Cochran's rule for the chi-square approximation`;
  if (main === 'exact' && !summary.cochranOk) return rule;
  if (!requested && !summary.cochranOk) {
    return `the exact test cannot allow for parameters estimated from the data, although ${rule}`;
  }
  if (main === 'exact') return 'it was requested and needs no large-sample approximation';
  if (requested) return summary.cochranOk ? 'it was requested' : `it was requested, although ${rule}`;
  return "every expected count was large enough for the chi-square approximation (Cochran's rule holds)";
}

function adviceFor(
  summary: ReturnType<typeof summariseExpectedCounts>,
  labels: readonly string[],
  expected: readonly number[],
  ordered: boolean,
  estimatedParameters: number,
): Advice[] {
  if (summary.cochranOk) {
    return [{ code: 'none', message: "Expected counts are large enough for the chi-square approximation (Cochran's rule holds)." }];
  }
  const smallCounts = `${summary.cellsBelow5} of ${labels.length} expected counts are below 5 (smallest ${Number(summary.minExpected.toPrecision(3))}), so chi-square p-values may be off`;
  // With estimated parameters the exact test is not available (see analyze), so it is not advised.
  // (the approximation-doubtful warning then says the p-value is approximate).
  const advice: Advice[] =
    estimatedParameters > 0 ? [] : [{ code: 'use-exact', message: `Use the exact multinomial test: ${smallCounts}.` }];
  const plan = proposeMerge(labels, expected, ordered, estimatedParameters);
  if (plan) {
    advice.push({
      code: 'merge-categories',
      message: `${advice.length > 0 ? 'Or merge' : `Merge`} sparse categories (${plan.groups.map((group) => group.label).join('; ')}) so that Cochran's rule holds; this changes the question being tested.`,
      plan,
    });
  }
  return advice;
}

/** "1 parameter (lambda) was" / "2 parameters were", for sentences about estimates. */
function estimatedPhrase(resolved: { estimatedParameters: number; estimatedNames?: string[] }): string {
  const count = resolved.estimatedParameters;
  const names = resolved.estimatedNames?.length ? ` (${resolved.estimatedNames.join(' and ')})` : '';
  return `${count} parameter${count === 1 ? '' : 's'}${names} ${count === 1 ? 'was' : 'were'}`;
}

/**
 * An expected share so small that (O − E)² / E overflows a double: no statistic, p-value or effect
 * size can be computed, so the input is refused, naming the category.
 */
function shareTooSmall(
  spec: AnalysisSpec,
  labels: readonly string[],
  active: readonly number[],
  activeShares: readonly number[],
): EngineInputError {
  const smallest = activeShares.indexOf(Math.min(...activeShares));
  const label = labels[active[smallest]];
  const position = spec.observed.labels.indexOf(label);
  const path = 'values' in spec.hypothesis && position >= 0 ? `hypothesis.values.${position}` : 'hypothesis';
  return EngineInputError.at(
    path,
    `the expected share of category "${label}" (${activeShares[smallest].toPrecision(3)}) is too small to test against: the chi-square statistic overflows`,
  );
}

function sum(values: readonly number[]): number {
  let total = 0;
  for (const value of values) total += value;
  return total;
}

/** Run the analysis described by `input` (validated; throws EngineInputError naming every problem). */
export function analyze(input: AnalysisSpec, options: AnalyzeOptions = {}): AnalysisResult {
  const spec = parseAnalysisSpec(input);
  const resolved = resolveHypothesis(spec);
  const labels = resolved.cells?.labels ?? spec.observed.labels;
  const counts = resolved.cells?.counts ?? spec.observed.counts;
  const shares = resolved.shares;
  const n = sum(counts);
  const k = labels.length;
  const alpha = spec.alpha ?? DEFAULT_ALPHA;
  const warnings: EngineWarning[] = [...resolved.warnings];

  shares.forEach((share, index) => {
    if (!(share > 0) && counts[index] > 0) {
      throw EngineInputError.at(
        `observed.counts.${spec.observed.labels.indexOf(labels[index])}`,
        `category "${labels[index]}" has ${counts[index]} observations but its expected share under ${resolved.description} is 0`,
      );
    }
  });
  const active = shares.map((share, index) => index).filter((index) => shares[index] > 0);
  if (active.length < k) {
    warnings.push({
      code: 'empty-categories-excluded',
      message: `${k - active.length} ${k - active.length === 1 ? 'category is' : 'categories are'} expected to be empty and ${k - active.length === 1 ? 'was' : 'were'} left out of the tests.`,
    });
  }
  const activeCounts = active.map((index) => counts[index]);
  const activeShares = active.map((index) => shares[index]);
  const activeExpected = activeShares.map((share) => share * n);
  const df = active.length - 1 - resolved.estimatedParameters;
  if (df < 1) {
    throw EngineInputError.at(
      'hypothesis',
      `no degrees of freedom are left: ${active.length} categories with non-zero expected share and ${resolved.estimatedParameters} estimated parameters`,
    );
  }
  const expected = shares.map((share) => share * n);

  const summary = summariseExpectedCounts(activeExpected);
  const requested = spec.tests;
  // The exact test takes the expected shares as known; with parameters estimated from these counts
  // its p-value would be too large (the fit is closer than known shares would be), and only the
  // chi-square tests' degrees of freedom allow for the estimates. So it is not offered then.
  const estimated = resolved.estimatedParameters;
  if (estimated > 0 && requested?.includes('exact')) {
    throw EngineInputError.at(
      `tests.${requested.indexOf('exact')}`,
      `the exact test needs fully specified expected shares, but ${estimatedPhrase(resolved)} estimated from the data; give the parameter values, or use pearson or g, whose degrees of freedom allow for the estimate`,
    );
  }
  const exactByDefault = !summary.cochranOk && estimated === 0;
  const ran: TestName[] = requested ? [...requested] : ['pearson', 'g', ...(exactByDefault ? ['exact' as const] : [])];

  const pearsonValue = pearsonStatistic(activeCounts, activeExpected);
  if (!Number.isFinite(pearsonValue)) throw shareTooSmall(spec, labels, active, activeShares);
  const tests: AnalysisTests = {};
  const lines: Report['lines'] = {};
  for (const test of ran) {
    if (test === 'pearson') {
      tests.pearson = chiSquareTestResult(pearsonValue, df);
      lines.pearson = pearsonLine(tests.pearson, n, alpha);
    } else if (test === 'g') {
      const g = chiSquareTestResult(gStatistic(activeCounts, activeExpected), df);
      const q = williamsCorrection(active.length, n, df);
      const corrected = chiSquareTestResult(g.statistic / q, df);
      tests.g = { ...g, williams: { q, statistic: corrected.statistic, p: corrected.p, logP: corrected.logP } };
      lines.g = spec.williams ? gLine(corrected, n, alpha, q) : gLine(g, n, alpha);
    } else if (test === 'cressie-read') {
      // `+ 0` turns a −0 from the spec into 0, which JSON would do anyway.
      const lambda = (spec.cressieReadLambda ?? DEFAULT_CRESSIE_READ_LAMBDA) + 0;
      const statistic = cressieReadStatistic(activeCounts, activeExpected, lambda);
      if (!Number.isFinite(statistic)) throw shareTooSmall(spec, labels, active, activeShares);
      const cressieRead = { ...chiSquareTestResult(statistic, df), lambda };
      tests['cressie-read'] = cressieRead;
      lines['cressie-read'] = cressieReadLine(cressieRead, n, lambda, alpha);
    } else {
      const exact = runExactTest(spec, activeCounts, activeShares, options.onProgress);
      tests.exact = exact.result;
      lines.exact = exactLine(exact.result, n, alpha);
      warnings.push(...exact.warnings);
    }
  }

  const mainTest = chooseMainTest(requested, ran, summary.cochranOk);
  const mainP =
    mainTest === 'g' && spec.williams && tests.g ? tests.g.williams.p : (tests[mainTest] as { p: number }).p;
  if (!summary.cochranOk && !ran.includes('exact')) {
    warnings.push({
      code: 'approximation-doubtful',
      message: `${summary.cellsBelow5} of ${active.length} expected counts are below 5, so the chi-square p-values may be inaccurate; ${
        estimated > 0
          ? `the exact test could not be used because ${estimatedPhrase(resolved)} estimated from the data (merging sparse categories helps)`
          : 'the exact test was not requested'
      }.`,
    });
  }

  const posthocAdjust = spec.posthoc?.adjust ?? 'holm';
  const rawP = active.map((index) => binomialTest(counts[index], n, shares[index]).p);
  const adjustedActive = adjustPValues(rawP, posthocAdjust);
  const intervalMethod = spec.intervals?.method ?? 'wilson';
  const intervalLevel = spec.intervals?.level ?? DEFAULT_INTERVAL_LEVEL;
  const intervals = shareIntervals(counts, intervalMethod, intervalLevel);

  const positionInActive = new Array<number>(k).fill(-1);
  active.forEach((index, position) => (positionInActive[index] = position));
  const categories: CategoryRow[] = labels.map((label, index) => {
    const observed = counts[index];
    const e = expected[index];
    const share = shares[index];
    const position = positionInActive[index];
    return {
      label,
      observed,
      expected: e,
      share: observed / n,
      expectedShare: share,
      residual: e > 0 ? (observed - e) / Math.sqrt(e) : 0,
      adjustedResidual: e > 0 && share < 1 ? (observed - e) / Math.sqrt(e * (1 - share)) : 0,
      p: position >= 0 ? rawP[position] : 1,
      pAdjusted: position >= 0 ? adjustedActive[position] : 1,
      interval: intervals[index],
    };
  });

  const w = cohensW(pearsonValue, n);
  const partial: Omit<AnalysisResult, 'report' | 'engineVersion'> = {
    n,
    k,
    df,
    expected,
    warnings,
    hypothesis: {
      kind: spec.hypothesis.kind,
      description: resolved.description,
      estimatedParameters: resolved.estimatedParameters,
      ...(resolved.fitted ? { fitted: resolved.fitted } : {}),
      ...(resolved.estimatedNames ? { estimatedNames: resolved.estimatedNames } : {}),
    },
    tests,
    conclusion: {
      test: mainTest,
      p: mainP,
      alpha,
      significant: mainP < alpha,
      verdict:
        mainP < alpha
          ? `The observed counts differ from what was expected (${formatPAt(mainP, alpha)}, below α = ${alpha}).`
          : `These data show no detectable difference from what was expected (${formatPAt(mainP, alpha)}, not below α = ${alpha}).`,
    },
    assumptions: {
      minExpected: summary.minExpected,
      shareBelow5: summary.shareBelow5,
      cellsBelow5: summary.cellsBelow5,
      cellsBelow1: summary.cellsBelow1,
      cochranOk: summary.cochranOk,
      advice: adviceFor(
        summary,
        active.map((index) => labels[index]),
        activeExpected,
        spec.hypothesis.kind === 'distribution',
        resolved.estimatedParameters,
      ),
    },
    effectSize: { w, size: effectSizeWord(w), interval: cohensWInterval(pearsonValue, df, n, intervalLevel) },
    categories,
    intervals: { method: intervalMethod, level: intervalLevel, simultaneous: intervalMethod !== 'wilson' },
    posthoc: { adjust: posthocAdjust },
  };

  const mainLine =
    mainTest === 'g' && spec.williams && lines.g ? lines.g : (lines[mainTest] as string);
  const notes = [...resolved.notes];
  notes.push(...(spec.notes ?? []));
  if (resolved.estimatedParameters > 0 && spec.hypothesis.kind !== 'distribution') {
    notes.push(
      `${resolved.estimatedParameters} parameter${resolved.estimatedParameters === 1 ? ' was' : 's were'} estimated from the data, so the degrees of freedom were reduced to ${df}.`,
    );
  }
  const report = writeUp({
    result: partial,
    lines,
    mainTest,
    mainLine,
    reason: mainTestReason(mainTest, requested, summary, active.length),
    notes,
    williamsUsed: spec.williams === true,
    merged: (spec.mergedCategories?.length ?? 0) > 0,
  });
  options.onProgress?.(1);
  return { ...partial, report, engineVersion: ENGINE_VERSION };
}
