/**
 * The result of `analyze`: plain JSON (no NaN, no Infinity), camelCase keys that other parts of
 * Tallyfit and its users rely on; tests are keyed by their spec names (`cressie-read`). Optional keys are absent when the test or option was not run.
 */
import type { ChiSquareTestResult } from '../statistics/chi-square-test';
import type { EngineWarning } from './engine-warning';
import type { AdjustMethod, ExactOrdering, ExactResultMethod, IntervalMethod, TestName } from '../spec/vocabulary';

export type { EngineWarning } from './engine-warning';
export type { ChiSquareTestResult } from '../statistics/chi-square-test';

export interface GTestResult extends ChiSquareTestResult {
  /** Williams' correction: q, the corrected statistic G / q and its p-value */
  williams: { q: number; statistic: number; p: number; logP: number };
}

export interface CressieReadTestResult extends ChiSquareTestResult {
  lambda: number;
}

export interface ExactTestResult {
  ordering: ExactOrdering;
  /** `binomial` when k = 2 and the ordering is by probability (the two-sided exact binomial test) */
  method: ExactResultMethod;
  p: number;
  logP: number;
  /** Monte Carlo standard error of p */
  se?: number;
  /** Monte Carlo draws */
  samples?: number;
  seed?: number;
  /** outcomes the exact computation visited */
  outcomesVisited?: number;
  /** certified upper bound on probability mass left out by the exact computation */
  massBound?: number;
}

/** Keyed by the test names of the spec (`testNames`). */
export interface AnalysisTests {
  pearson?: ChiSquareTestResult;
  g?: GTestResult;
  'cressie-read'?: CressieReadTestResult;
  exact?: ExactTestResult;
}

export type AdviceCode = 'none' | 'use-exact' | 'merge-categories';

export interface MergeGroup {
  /** label of the merged category */
  label: string;
  /** labels of the categories it combines */
  members: string[];
}

export interface MergePlan {
  groups: MergeGroup[];
}

export interface Advice {
  code: AdviceCode;
  message: string;
  /** for `merge-categories`: the proposed plan, ready for `mergeCategories(spec, plan)` */
  plan?: MergePlan;
}

export interface AssumptionCheck {
  minExpected: number;
  /** share of categories whose expected count is below 5 */
  shareBelow5: number;
  cellsBelow5: number;
  cellsBelow1: number;
  /** Cochran's rule: no expected count below 1 and at most 20% below 5 */
  cochranOk: boolean;
  advice: Advice[];
}

export type EffectSizeWord = 'negligible' | 'small' | 'medium' | 'large';

export interface EffectSize {
  /** Cohen's w = √(X² / n) */
  w: number;
  size: EffectSizeWord;
  /** confidence interval for w from the noncentral chi-square distribution */
  interval?: { low: number; high: number; level: number };
}

export interface CategoryRow {
  label: string;
  observed: number;
  expected: number;
  /** observed share n_i / n */
  share: number;
  expectedShare: number;
  /** Pearson residual (O − E) / √E */
  residual: number;
  /** adjusted residual (O − E) / √(E (1 − p)) */
  adjustedResidual: number;
  /** two-sided exact binomial p-value of this category's count against its expected share */
  p: number;
  pAdjusted: number;
  /** interval for this category's share (method and level in `intervals`) */
  interval: { low: number; high: number };
}

export interface Report {
  /** APA-style statistics line of the main test, e.g. `χ²(3, N = 556) = 0.47, p = .925` */
  line: string;
  /** the statistics line of every test that was run */
  lines: Partial<Record<TestName, string>>;
  methods: string;
  results: string;
  /** Markdown table of the categories */
  table: string;
  cautions: string[];
  /** the whole write-up as one Markdown document */
  markdown: string;
}

/** The test a verdict rests on: one of the spec's test names. */
export type MainTest = TestName;

export interface Conclusion {
  /** the test the verdict rests on */
  test: MainTest;
  p: number;
  alpha: number;
  /** p < alpha */
  significant: boolean;
  /** one plain sentence */
  verdict: string;
}

export interface HypothesisSummary {
  kind: 'equal' | 'proportions' | 'ratio' | 'counts' | 'distribution';
  description: string;
  estimatedParameters: number;
  /** parameter values of a fitted family, given or estimated */
  fitted?: Record<string, number>;
  estimatedNames?: string[];
}

export interface AnalysisResult {
  n: number;
  k: number;
  df: number;
  /** expected count per category, in input order */
  expected: number[];
  warnings: EngineWarning[];
  hypothesis: HypothesisSummary;
  tests: AnalysisTests;
  conclusion: Conclusion;
  assumptions: AssumptionCheck;
  effectSize: EffectSize;
  categories: CategoryRow[];
  intervals: { method: IntervalMethod; level: number; simultaneous: boolean };
  posthoc: { adjust: AdjustMethod };
  report: Report;
  engineVersion: string;
}
